import { QueryTypes } from "sequelize";
import { credentialTypeByCode } from "../../shared/credentials/catalogue.ts";
import { fieldSetSchemas } from "../../shared/credentials/credential-fields.ts";
import { computeTechnicianStanding } from "../../shared/standing/compute-standing.ts";
import type { Requirement } from "../../shared/standing/requirements.ts";
import type {
  CredentialState,
  StandingCredential,
  StandingResult,
} from "../../shared/standing/standing-types.ts";
import { db } from "../db/sequelize.ts";

interface CredentialRow {
  id: number;
  type_code: string;
  technician_id: number | null;
  state: CredentialState;
  fields: unknown;
}

function toStandingCredential(row: CredentialRow): StandingCredential | null {
  const type = credentialTypeByCode.get(row.type_code);
  if (!type) return null;
  const parsed = fieldSetSchemas[type.fieldSet].safeParse(row.fields);
  // A row whose fields no longer parse cannot meet anything; the engine reports the requirement as missing.
  if (!parsed.success) return null;
  return {
    id: row.id,
    typeCode: row.type_code,
    state: row.state,
    fields: parsed.data,
    holder: row.technician_id === null ? "company" : "technician",
  };
}

/**
 * Standing computed now with the shared engine, for a requirement set the standing job has not stored yet for this
 * technician (e.g. a set created a moment ago).
 */
export async function computeStandingNow(
  technician: { id: number; name: string; companyId: number; timeZone: string },
  requirementSets: { id: number; requirements: Requirement[] }[],
  asOf: Date,
): Promise<Map<number, StandingResult>> {
  const out = new Map<number, StandingResult>();
  if (requirementSets.length === 0) return out;
  const rows = await db().query<CredentialRow>(
    `SELECT id, type_code, technician_id, state, fields FROM credentials
      WHERE state <> 'superseded' AND ((company_id = $1 AND technician_id IS NULL) OR technician_id = $2)`,
    { bind: [technician.companyId, technician.id], type: QueryTypes.SELECT },
  );
  const credentials = rows.map(toStandingCredential).filter((c): c is StandingCredential => c !== null);
  const [count] = await db().query<{ headcount: number }>(
    `SELECT count(*)::int AS headcount FROM technicians WHERE company_id = $1 AND active`,
    { bind: [technician.companyId], type: QueryTypes.SELECT },
  );
  for (const set of requirementSets) {
    out.set(
      set.id,
      computeTechnicianStanding({
        companyCredentials: credentials.filter((c) => c.holder === "company"),
        technicianCredentials: credentials.filter((c) => c.holder === "technician"),
        requirements: set.requirements,
        companyTimeZone: technician.timeZone,
        technician: { id: technician.id, name: technician.name },
        companyHeadcount: count?.headcount ?? 0,
        asOf,
      }),
    );
  }
  return out;
}
