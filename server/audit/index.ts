import type { Transaction } from "sequelize";
import { AuditEvent } from "./model.ts";

export { AuditEvent, initAuditModel } from "./model.ts";

export interface AuditEntry {
  actorUserId: number | null;
  action: string;
  subjectType: string;
  subjectId: number;
  before?: unknown;
  after?: unknown;
}

/** Writes one append-only audit event inside the caller's transaction. */
export async function recordAudit(entry: AuditEntry, transaction?: Transaction): Promise<void> {
  await AuditEvent.create(
    { ...entry, before: entry.before ?? null, after: entry.after ?? null },
    { transaction },
  );
}

export async function auditTrail(subjectType: string, subjectId: number) {
  return AuditEvent.findAll({ where: { subjectType, subjectId }, order: [["id", "ASC"]] });
}
