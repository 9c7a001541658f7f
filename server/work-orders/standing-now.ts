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
  const snapshots = await standingSnapshotsNow(
    [technicianId],
    requirementSetId,
    asOf,
    warningDays,
    transaction,
  );
  const snapshot = snapshots.get(technicianId);
  if (!snapshot) throw new Error(`No technician ${technicianId}`);
  return snapshot;
}

/**
 * standingSnapshotNow for several technicians against one set, in the same three statements whatever their number
 * (the estimate comparison shows one per estimate). Technicians that do not exist are absent from the map.
 */
export async function standingSnapshotsNow(
  technicianIds: readonly number[],
  requirementSetId: number | null,
  asOf: Date,
  warningDays: number,
  transaction?: Transaction,
): Promise<Map<number, StandingSnapshot>> {
  const out = new Map<number, StandingSnapshot>();
  const ids = [...new Set(technicianIds)];
  if (ids.length === 0) return out;
  // Superseded credentials never count; lapsed and returned ones stay so the engine can say why a requirement is unmet.
  const readTechnicians = () =>
    select<TechnicianRow>(
      `SELECT t.id, t.name, t.company_id, co.name AS company_name, co.time_zone,
              (SELECT count(*)::int FROM technicians x WHERE x.company_id = t.company_id AND x.active) AS headcount
         FROM technicians t JOIN companies co ON co.id = t.company_id WHERE t.id = ANY($1::int[])`,
      [ids],
      transaction,
    );
  const readCredentials = () =>
    select<CredentialRow & { company_id: number }>(
      `SELECT c.id, c.type_code, c.technician_id, c.company_id, c.state, c.fields FROM credentials c
        WHERE c.state <> 'superseded'
          AND (c.technician_id = ANY($1::int[])
            OR (c.technician_id IS NULL AND c.company_id IN (SELECT company_id FROM technicians WHERE id = ANY($1::int[]))))
        ORDER BY c.id`,
      [ids],
      transaction,
    );
  const readTargets = () =>
    select<TargetRow>(
      `SELECT NULL::int AS id, 'Platform baseline' AS name, requirements FROM platform_baseline
       UNION ALL
       SELECT id, name, requirements FROM requirement_sets WHERE id = $1
       ORDER BY id NULLS FIRST`,
      [requirementSetId ?? 0],
      transaction,
    );
  // One client runs one statement at a time: inside a transaction the reads go in turn, outside it side by side.
  const [technicians, rows, types, targets] = transaction
    ? [await readTechnicians(), await readCredentials(), await loadCatalogue(), await readTargets()]
    : await Promise.all([readTechnicians(), readCredentials(), loadCatalogue(), readTargets()]);

  // Each row parsed once; a credential whose fields no longer parse cannot count, exactly as in the stored standings.
  const parsedRows: {
    row: CredentialRow & { company_id: number };
    credential: StandingCredential;
    source: SnapshotCredentialSource;
  }[] = [];
  for (const row of rows) {
    const type = types.get(row.type_code);
    const parsed = type ? fieldSetSchemas[type.fieldSet].safeParse(row.fields) : undefined;
    if (!parsed?.success) continue;
    parsedRows.push({
      row,
      credential: {
        id: row.id,
        typeCode: row.type_code,
        state: row.state,
        fields: parsed.data,
        holder: row.technician_id === null ? "company" : "technician",
      },
      source: { id: row.id, typeCode: row.type_code, fields: parsed.data },
    });
  }
  const typeNames = new Map([...types.values()].map((t) => [t.code, t.name]));

  for (const technician of technicians) {
    const companyCredentials: StandingCredential[] = [];
    const technicianCredentials: StandingCredential[] = [];
    const sources = new Map<number, SnapshotCredentialSource>();
    for (const { row, credential, source } of parsedRows) {
      if (row.technician_id === technician.id) technicianCredentials.push(credential);
      else if (row.technician_id === null && row.company_id === technician.company_id)
        companyCredentials.push(credential);
      else continue;
      sources.set(row.id, source);
    }
    out.set(
      technician.id,
      buildStandingSnapshot({
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
        typeNames,
      }),
    );
  }
  return out;
}
