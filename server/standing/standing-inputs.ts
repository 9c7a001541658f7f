import type { Transaction } from "sequelize";
import type { CredentialTypeDefinition } from "../../shared/credentials/catalogue.ts";
import { fieldSetSchemas } from "../../shared/credentials/credential-fields.ts";
import { underlyingTypeCodesFor } from "../../shared/standing/compute-standing.ts";
import { wantsStackedLimits } from "../../shared/standing/requirement-content.ts";
import type { Requirement } from "../../shared/standing/requirements.ts";
import type { CredentialState, StandingCredential } from "../../shared/standing/standing-types.ts";
import { log } from "../log.ts";
import { selectRows } from "../db/sql.ts";

export interface StandingTechnician {
  id: number;
  companyId: number;
  active: boolean;
  timeZone: string;
  name: string;
  /** Active technicians of the company: an exemption naming fewer people cannot stand in for a policy. */
  companyHeadcount: number;
}

/** A requirement set as the engine needs it; `id` null = the platform baseline. */
export interface StandingTarget {
  id: number | null;
  name: string;
  requirements: Requirement[];
}

export interface StandingInputs {
  technicians: StandingTechnician[];
  companyCredentials: Map<number, StandingCredential[]>;
  technicianCredentials: Map<number, StandingCredential[]>;
  types: Map<string, CredentialTypeDefinition>;
  targets: StandingTarget[];
}

/** Which technicians to load: everyone, or the technicians of some companies plus some named technicians. */
export type HolderSelection = "all" | { companyIds: number[]; technicianIds: number[] };

interface TechnicianRow {
  id: number;
  company_id: number;
  active: boolean;
  time_zone: string;
  name: string;
  headcount: number;
}
export interface StandingCredentialRow {
  id: number;
  type_code: string;
  company_id: number;
  technician_id: number | null;
  state: CredentialState;
  fields: unknown;
}
interface TypeRow {
  code: string;
  name: string;
  category: CredentialTypeDefinition["category"];
  holder: CredentialTypeDefinition["holder"];
  field_set: CredentialTypeDefinition["fieldSet"];
  validity: CredentialTypeDefinition["validity"];
  description: string;
}
interface TargetRow {
  id: number | null;
  name: string;
  requirements: Requirement[];
}

// The headcount is one grouped pass over technicians, not a sub-query per row.
const TECHNICIANS_SQL = `SELECT t.id, t.company_id, t.active, co.time_zone, t.name, COALESCE(hc.headcount, 0) AS headcount
  FROM technicians t JOIN companies co ON co.id = t.company_id
  LEFT JOIN (SELECT company_id, count(*)::int AS headcount FROM technicians WHERE active GROUP BY company_id) hc
    ON hc.company_id = t.company_id`;

async function loadTechnicians(
  selection: HolderSelection,
  transaction: Transaction,
): Promise<StandingTechnician[]> {
  const rows =
    selection === "all"
      ? await selectRows<TechnicianRow>(transaction, `${TECHNICIANS_SQL} ORDER BY t.id`)
      : await selectRows<TechnicianRow>(
          transaction,
          `${TECHNICIANS_SQL} WHERE t.company_id = ANY($1::int[]) OR t.id = ANY($2::int[]) ORDER BY t.id`,
          [selection.companyIds, selection.technicianIds],
        );
  return rows.map((r) => ({
    id: r.id,
    companyId: r.company_id,
    active: r.active,
    timeZone: r.time_zone,
    name: r.name,
    companyHeadcount: r.headcount,
  }));
}

// Superseded credentials never count (a newer one of the same type was verified); lapsed and returned ones stay so the
// engine can say why a requirement is unmet.
const CREDENTIALS_SQL = `SELECT id, type_code, company_id, technician_id, state, fields FROM credentials WHERE state <> 'superseded'`;

const UMBRELLA = "umbrella_liability";

/**
 * The credential types the shared engine can read for these targets: each requirement's own types, the policies an
 * umbrella stands over (underlyingTypeCodesFor), and umbrellas where a line may stack one over a primary policy. A
 * credential of any other type never changes a standing against them, so it is neither read nor validated (on the
 * large data set the baseline reads 2 types of 11: about 50,000 cards fewer per lapse run).
 */
export function typesReadFor(targets: readonly StandingTarget[]): string[] {
  const codes = new Set<string>();
  for (const target of targets) {
    for (const requirement of target.requirements) {
      for (const code of requirement.typeCodes) codes.add(code);
      if (wantsStackedLimits(requirement)) codes.add(UMBRELLA);
    }
    for (const code of underlyingTypeCodesFor(target.requirements)) codes.add(code);
  }
  return [...codes];
}

async function loadCredentials(
  technicians: StandingTechnician[],
  all: boolean,
  typeCodes: string[],
  transaction: Transaction,
) {
  if (all)
    return selectRows<StandingCredentialRow>(
      transaction,
      `${CREDENTIALS_SQL} AND type_code = ANY($1::text[])`,
      [typeCodes],
    );
  const companyIds = [...new Set(technicians.map((t) => t.companyId))];
  return selectRows<StandingCredentialRow>(
    transaction,
    `${CREDENTIALS_SQL} AND type_code = ANY($3::text[])
       AND ((technician_id IS NULL AND company_id = ANY($1::int[])) OR technician_id = ANY($2::int[]))`,
    [companyIds, technicians.map((t) => t.id), typeCodes],
  );
}

export async function loadCredentialTypes(
  transaction: Transaction,
): Promise<Map<string, CredentialTypeDefinition>> {
  const rows = await selectRows<TypeRow>(
    transaction,
    "SELECT code, name, category, holder, field_set, validity, description FROM credential_types",
  );
  return new Map(
    rows.map((r) => [
      r.code,
      {
        code: r.code,
        name: r.name,
        category: r.category,
        holder: r.holder,
        fieldSet: r.field_set,
        validity: r.validity,
        description: r.description,
      },
    ]),
  );
}

/** The baseline first, then every active requirement set (or only the named ones). */
export async function loadTargets(transaction: Transaction, setIds?: number[]): Promise<StandingTarget[]> {
  const onlySets = setIds !== undefined;
  return selectRows<TargetRow>(
    transaction,
    `SELECT NULL::int AS id, 'Platform baseline' AS name, requirements FROM platform_baseline WHERE NOT $1::boolean
     UNION ALL
     SELECT id, name, requirements FROM requirement_sets WHERE active AND (NOT $1::boolean OR id = ANY($2::int[]))
     ORDER BY id NULLS FIRST`,
    [onlySets, setIds ?? []],
  );
}

export function toStandingCredential(
  row: StandingCredentialRow,
  types: Map<string, CredentialTypeDefinition>,
): StandingCredential | null {
  const type = types.get(row.type_code);
  if (!type) return null;
  const parsed = fieldSetSchemas[type.fieldSet].safeParse(row.fields);
  if (!parsed.success) {
    // A credential whose stored fields no longer parse cannot count; the standing then says the requirement is missing.
    log.warn({ credentialId: row.id }, "credential fields do not parse; left out of standing");
    return null;
  }
  return {
    id: row.id,
    typeCode: row.type_code,
    state: row.state,
    fields: parsed.data,
    holder: row.technician_id === null ? "company" : "technician",
  };
}

function push<K>(map: Map<K, StandingCredential[]>, key: K, value: StandingCredential) {
  const list = map.get(key);
  if (list) list.push(value);
  else map.set(key, [value]);
}

export async function loadStandingInputs(
  selection: HolderSelection,
  transaction: Transaction,
  options: { targets?: StandingTarget[] } = {},
): Promise<StandingInputs> {
  const technicians = await loadTechnicians(selection, transaction);
  // In turn: the transaction's one connection runs one statement at a time.
  const types = await loadCredentialTypes(transaction);
  const targets = options.targets ?? (await loadTargets(transaction));
  const rows = technicians.length
    ? await loadCredentials(technicians, selection === "all", typesReadFor(targets), transaction)
    : [];
  const companyCredentials = new Map<number, StandingCredential[]>();
  const technicianCredentials = new Map<number, StandingCredential[]>();
  for (const row of rows) {
    const credential = toStandingCredential(row, types);
    if (!credential) continue;
    if (row.technician_id === null) push(companyCredentials, row.company_id, credential);
    else push(technicianCredentials, row.technician_id, credential);
  }
  return { technicians, companyCredentials, technicianCredentials, types, targets };
}
