import { QueryTypes } from "sequelize";
import type { AddRosterEntry, RosterEntryDto, RosterTechnicianDto } from "../../shared/roster/schemas.ts";
import type { Standing } from "../../shared/standing/standing-types.ts";
import { db } from "../db/sequelize.ts";
import { AppError } from "../http/app-error.ts";
import { recordAudit } from "../audit/index.ts";
import { atLeast, isListed } from "../../shared/visibility/technician-visibility.ts";
import { viewLevelOf } from "../technicians/visibility.ts";

const select = <T extends object>(sql: string, bind: unknown[]) =>
  db().query<T>(sql, { bind, type: QueryTypes.SELECT });

interface EntryRow {
  id: number;
  technician_id: number | null;
  service_company_id: number | null;
  subject_name: string;
  company_name: string;
  created_at: Date;
}

interface MemberRow {
  entry_id: number;
  technician_id: number;
  name: string;
  company_id: number;
  company_name: string;
  active: boolean;
  standing: Standing | null;
  earliest_lapse: Date | null;
}

/** The shop's roster with each technician's stored baseline standing and next lapse. */
export async function listRoster(shopId: number): Promise<RosterEntryDto[]> {
  const [entries, members] = await Promise.all([
    select<EntryRow>(
      `SELECT re.id, re.technician_id, re.service_company_id, coalesce(t.name, sc.name) AS subject_name,
              coalesce(tc.name, sc.name) AS company_name, re.created_at
         FROM roster_entries re
         LEFT JOIN technicians t ON t.id = re.technician_id
         LEFT JOIN companies tc ON tc.id = t.company_id
         LEFT JOIN companies sc ON sc.id = re.service_company_id
        WHERE re.shop_company_id = $1
        ORDER BY subject_name, re.id`,
      [shopId],
    ),
    select<MemberRow>(
      `SELECT re.id AS entry_id, t.id AS technician_id, t.name, t.company_id, c.name AS company_name, t.active,
              b.standing, b.earliest_lapse
         FROM roster_entries re
         JOIN technicians t ON t.id = re.technician_id OR t.company_id = re.service_company_id
         JOIN companies c ON c.id = t.company_id
         LEFT JOIN technician_standings b ON b.technician_id = t.id AND b.requirement_set_id IS NULL
        WHERE re.shop_company_id = $1
        ORDER BY t.name, t.id`,
      [shopId],
    ),
  ]);
  const byEntry = new Map<number, RosterTechnicianDto[]>();
  // The shared rule: a shop sees only listed technicians, so a company entry never reveals its hidden ones.
  for (const m of members.filter((x) => isListed({ active: x.active, baseline: x.standing }))) {
    const list = byEntry.get(m.entry_id) ?? [];
    list.push({
      technicianId: m.technician_id,
      name: m.name,
      companyId: m.company_id,
      companyName: m.company_name,
      active: m.active,
      standing: m.standing,
      nextLapse: m.earliest_lapse ? new Date(m.earliest_lapse).toISOString() : null,
    });
    byEntry.set(m.entry_id, list);
  }
  return entries.map((e) => ({
    id: e.id,
    kind: e.technician_id !== null ? "technician" : "company",
    technicianId: e.technician_id,
    serviceCompanyId: e.service_company_id,
    name: e.subject_name,
    companyName: e.company_name,
    addedAt: new Date(e.created_at).toISOString(),
    technicians: byEntry.get(e.id) ?? [],
  }));
}

async function checkSubject(actor: Express.User, input: AddRosterEntry): Promise<void> {
  if (input.technicianId !== undefined) {
    // Buyers add technicians they can see (the shared visibility rule); anyone else answers 404.
    if (!atLeast(await viewLevelOf(actor, input.technicianId), "directory"))
      throw new AppError("not_found", "That technician was not found");
    return;
  }
  const rows = await select<{ id: number }>("SELECT id FROM companies WHERE id = $1 AND kind = 'service'", [
    input.serviceCompanyId,
  ]);
  if (rows.length === 0) throw new AppError("not_found", "That service company was not found");
}

export async function addToRoster(actor: Express.User, input: AddRosterEntry): Promise<RosterEntryDto> {
  await checkSubject(actor, input);
  const id = await db().transaction(async (transaction) => {
    const [inserted] = await db().query<{ id: number }>(
      `INSERT INTO roster_entries (shop_company_id, technician_id, service_company_id, added_by)
       VALUES ($1, $2, $3, $4) ON CONFLICT DO NOTHING RETURNING id`,
      {
        bind: [actor.companyId, input.technicianId ?? null, input.serviceCompanyId ?? null, actor.id],
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    if (!inserted) throw new AppError("conflict", "Already on the roster");
    await recordAudit(
      {
        actorUserId: actor.id,
        action: "roster.added",
        subjectType: "roster_entry",
        subjectId: inserted.id,
        after: input,
      },
      transaction,
    );
    return inserted.id;
  });
  const entry = (await listRoster(actor.companyId)).find((e) => e.id === id);
  return entry!;
}

export async function removeFromRoster(actor: Express.User, entryId: number): Promise<void> {
  await db().transaction(async (transaction) => {
    const removed = await db().query<{
      id: number;
      technician_id: number | null;
      service_company_id: number | null;
    }>(
      "DELETE FROM roster_entries WHERE id = $1 AND shop_company_id = $2 RETURNING id, technician_id, service_company_id",
      { bind: [entryId, actor.companyId], type: QueryTypes.SELECT, transaction },
    );
    if (removed.length === 0) throw new AppError("not_found", "That roster entry was not found");
    await recordAudit(
      {
        actorUserId: actor.id,
        action: "roster.removed",
        subjectType: "roster_entry",
        subjectId: entryId,
        before: removed[0],
      },
      transaction,
    );
  });
}
