import { z } from "zod";
import type { CredentialFields } from "../credentials/credential-fields.ts";
import {
  requirementStatuses,
  standings,
  unmetReasons,
  type Standing,
  type StandingResult,
} from "../standing/standing-types.ts";

/** A credential as the snapshot names it: enough to find the document again and to show what it said. */
export const snapshotCredentialSchema = z.object({
  id: z.number(),
  typeCode: z.string(),
  typeName: z.string(),
  /** Policy number, card number, license or certificate number: whatever the document is known by. */
  reference: z.string().nullable(),
  /** The field the reference was read from (policyNumber, cardNumber...), so each reader's field rule can apply to it. */
  referenceField: z.string().nullable().optional(),
  /** First instant it no longer counts (ISO), null = never. */
  lapsesAt: z.string().nullable(),
});
export type SnapshotCredential = z.infer<typeof snapshotCredentialSchema>;

export const snapshotRequirementSchema = z.object({
  label: z.string(),
  status: z.enum(requirementStatuses),
  reason: z.enum(unmetReasons).nullable(),
  detail: z.string(),
  /** How it was met ("GL $1M + umbrella $4M each occurrence"); null when unmet. Absent on snapshots taken before. */
  metBy: z.string().nullable().optional(),
  /** The credential that met it (or, when unmet, the closest one on file). */
  credential: snapshotCredentialSchema.nullable(),
});
export type SnapshotRequirement = z.infer<typeof snapshotRequirementSchema>;

export const snapshotTargetSchema = z.object({
  /** Null = the platform baseline. */
  requirementSetId: z.number().nullable(),
  name: z.string(),
  standing: z.enum(standings),
  earliestLapse: z.string().nullable(),
  requirements: z.array(snapshotRequirementSchema),
});
export type SnapshotTarget = z.infer<typeof snapshotTargetSchema>;

/** Proof of a technician's standing at one instant, kept on the work order whatever changes later. */
export const standingSnapshotSchema = z.object({
  takenAt: z.string(),
  technicianId: z.number(),
  technicianName: z.string(),
  companyName: z.string(),
  /** The worst of the targets' standings. */
  standing: z.enum(standings),
  targets: z.array(snapshotTargetSchema),
});
export type StandingSnapshot = z.infer<typeof standingSnapshotSchema>;

export interface SnapshotCredentialSource {
  id: number;
  typeCode: string;
  fields: CredentialFields;
}

const STANDING_ORDER: Record<Standing, number> = { cleared: 0, lapsing: 1, not_cleared: 2 };

export function worstStanding(standings: readonly Standing[]): Standing {
  return standings.reduce<Standing>(
    (worst, s) => (STANDING_ORDER[s] > STANDING_ORDER[worst] ? s : worst),
    "cleared",
  );
}

/** Lapsing still counts as cleared: every required credential is in force today. */
export function isClearedNow(standing: Standing): boolean {
  return standing !== "not_cleared";
}

/** The number a document is known by, and the field it came from, whichever field its field set carries. */
export function credentialReference(fields: CredentialFields): { field: string; value: string } | null {
  if ("policyNumber" in fields) return { field: "policyNumber", value: fields.policyNumber };
  if ("licenseNumber" in fields) return { field: "licenseNumber", value: fields.licenseNumber };
  if ("certificateNumber" in fields) return { field: "certificateNumber", value: fields.certificateNumber };
  if ("cardNumber" in fields && fields.cardNumber) return { field: "cardNumber", value: fields.cardNumber };
  return null;
}

export interface SnapshotInput {
  takenAt: Date;
  technician: { id: number; name: string; companyName: string };
  targets: { requirementSetId: number | null; name: string; result: StandingResult }[];
  credentials: ReadonlyMap<number, SnapshotCredentialSource>;
  typeNames: ReadonlyMap<string, string>;
}

export function buildStandingSnapshot(input: SnapshotInput): StandingSnapshot {
  const targets = input.targets.map(({ requirementSetId, name, result }) => ({
    requirementSetId,
    name,
    standing: result.standing,
    earliestLapse: result.earliestLapse,
    requirements: result.results.map((r) => {
      const source = r.credentialId === null ? undefined : input.credentials.get(r.credentialId);
      const reference = source ? credentialReference(source.fields) : null;
      return {
        label: r.requirement.label,
        status: r.status,
        reason: r.reason,
        detail: r.detail,
        metBy: r.metBy ?? null,
        credential: source
          ? {
              id: source.id,
              typeCode: source.typeCode,
              typeName: input.typeNames.get(source.typeCode) ?? source.typeCode,
              reference: reference?.value ?? null,
              referenceField: reference?.field ?? null,
              lapsesAt: r.lapsesAt,
            }
          : null,
      };
    }),
  }));
  return {
    takenAt: input.takenAt.toISOString(),
    technicianId: input.technician.id,
    technicianName: input.technician.name,
    companyName: input.technician.companyName,
    standing: worstStanding(targets.map((t) => t.standing)),
    targets,
  };
}

/** One line per unmet requirement, for the 409 that refuses a work order. */
export function unmetRequirements(snapshot: StandingSnapshot): { path: string; message: string }[] {
  return snapshot.targets.flatMap((t) =>
    t.requirements
      .filter((r) => r.status === "unmet")
      .map((r) => ({
        path: `standing.${t.requirementSetId ?? "baseline"}`,
        message: `${t.name}: ${r.label}: ${r.detail}`,
      })),
  );
}
