import { QueryTypes, type Transaction } from "sequelize";
import { fieldSetSchemas } from "../../shared/credentials/credential-fields.ts";
import type { Requirement } from "../../shared/standing/requirements.ts";
import type { StandingCredential } from "../../shared/standing/standing-types.ts";
import { computeTechnicianStanding } from "../../shared/standing/compute-standing.ts";
import {
  buildStandingSnapshot,
  type SnapshotCredentialSource,
  type StandingSnapshot,
} from "../../shared/work-orders/standing-snapshot.ts";
import { db } from "../db/sequelize.ts";
import { loadCatalogue } from "../credentials/index.ts";

interface TechnicianRow {
  id: number;
  name: string;
  company_id: number;
  company_name: string;
  time_zone: string;
  headcount: number;
}
interface CredentialRow {
  id: number;
  type_code: string;
  technician_id: number | null;
  state: StandingCredential["state"];
  fields: unknown;
}
interface TargetRow {
  id: number | null;
  name: string;
  requirements: Requirement[];
}

const select = <T extends object>(sql: string, bind: unknown[], transaction?: Transaction) =>
  db().query<T>(sql, { bind, transaction, type: QueryTypes.SELECT });

/**
 * The technician's standing at `asOf`, computed afresh with the shared engine from the credential rows. The stored
 * standings are written by the daily job and by each decision, so they can be up to a day old: a policy that lapsed a
 * second ago must already count here.
 */
export async function standingSnapshotNow(
  technicianId: number,
  requirementSetId: number | null,
  asOf: Date,
  warningDays: number,
  transaction?: Transaction,
): Promise<StandingSnapshot> {
  const [technician] = await select<TechnicianRow>(
    `SELECT t.id, t.name, t.company_id, co.name AS company_name, co.time_zone,
            (SELECT count(*)::int FROM technicians x WHERE x.company_id = t.company_id AND x.active) AS headcount
       FROM technicians t JOIN companies co ON co.id = t.company_id WHERE t.id = $1`,
    [technicianId],
    transaction,
  );
  if (!technician) throw new Error(`No technician ${technicianId}`);
  // Superseded credentials never count; lapsed and returned ones stay so the engine can say why a requirement is unmet.
  const [rows, types, targets] = await Promise.all([
    select<CredentialRow>(
      `SELECT id, type_code, technician_id, state, fields FROM credentials
        WHERE state <> 'superseded' AND ((technician_id IS NULL AND company_id = $1) OR technician_id = $2)`,
      [technician.company_id, technicianId],
      transaction,
    ),
    loadCatalogue(),
    select<TargetRow>(
      `SELECT NULL::int AS id, 'Platform baseline' AS name, requirements FROM platform_baseline
       UNION ALL
       SELECT id, name, requirements FROM requirement_sets WHERE id = $1
       ORDER BY id NULLS FIRST`,
      [requirementSetId ?? 0],
      transaction,
    ),
  ]);

  const companyCredentials: StandingCredential[] = [];
  const technicianCredentials: StandingCredential[] = [];
  const sources = new Map<number, SnapshotCredentialSource>();
  for (const row of rows) {
    const type = types.get(row.type_code);
    const parsed = type ? fieldSetSchemas[type.fieldSet].safeParse(row.fields) : undefined;
    // A credential whose fields no longer parse cannot count, exactly as in the stored standings.
    if (!parsed?.success) continue;
    const credential: StandingCredential = {
      id: row.id,
      typeCode: row.type_code,
      state: row.state,
      fields: parsed.data,
      holder: row.technician_id === null ? "company" : "technician",
    };
    (row.technician_id === null ? companyCredentials : technicianCredentials).push(credential);
    sources.set(row.id, { id: row.id, typeCode: row.type_code, fields: parsed.data });
  }

  return buildStandingSnapshot({
    takenAt: asOf,
    technician: { id: technician.id, name: technician.name, companyName: technician.company_name },
    targets: targets.map((target) => ({
      requirementSetId: target.id,
      name: target.name,
      result: computeTechnicianStanding({
        companyCredentials,
        technicianCredentials,
        requirements: target.requirements,
        companyTimeZone: technician.time_zone,
        technician: { id: technician.id, name: technician.name },
        companyHeadcount: technician.headcount,
        asOf,
        warningDays,
        types,
      }),
    })),
    credentials: sources,
    typeNames: new Map([...types.values()].map((t) => [t.code, t.name])),
  });
}
