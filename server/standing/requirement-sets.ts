import type { RequirementSetInput, RequirementSetPreviewDto } from "../../shared/standing/schemas.ts";
import type { Standing } from "../../shared/standing/standing-types.ts";
import { recordAudit } from "../audit/index.ts";
import { db } from "../db/sequelize.ts";
import { AppError, notFound } from "../http/app-error.ts";
import type { Transaction } from "sequelize";
import { MAX_ACTIVE_REQUIREMENT_SETS_PER_SHOP } from "../../shared/standing/requirement-set-limits.ts";
import type { SignedInUser } from "../http/policy.ts";
import { toRequirementSetDto } from "./dto.ts";
import { RequirementSet } from "./model.ts";
import { dropStandingsForRequirementSet, refreshStandingsForRequirementSet } from "./refresh-standing.ts";
import { assertKnownTypeCodes } from "./requirement-types-check.ts";
import { loadCredentialTypes, toStandingCredential, type StandingCredentialRow } from "./standing-inputs.ts";
import { lapsingWindowDays } from "./standing-window.ts";
import { countMeeting } from "../../shared/standing/count-meeting.ts";
import type { StandingCredential } from "../../shared/standing/standing-types.ts";
import { selectRows } from "../db/sql.ts";

export async function listRequirementSets(user: SignedInUser, includeArchived: boolean) {
  const sets = await RequirementSet.findAll({
    where: includeArchived ? { companyId: user.companyId } : { companyId: user.companyId, active: true },
    order: [
      ["name", "ASC"],
      ["id", "ASC"],
    ],
  });
  return sets.map(toRequirementSetDto);
}

/** Scoped by the buyer's own shop as a second guard behind the route policy. */
async function findOwnSet(user: SignedInUser, id: number) {
  const set = await RequirementSet.findOne({ where: { id, companyId: user.companyId } });
  if (!set) throw notFound("That requirement set");
  return set;
}

export async function findRequirementSet(user: SignedInUser, id: number) {
  return toRequirementSetDto(await findOwnSet(user, id));
}

/** A set may name one of the shop's own sites; anyone else's, or none at all, answers the same. */
async function assertOwnSite(
  user: SignedInUser,
  siteId: number | null | undefined,
  transaction: Transaction,
) {
  if (siteId === null || siteId === undefined) return;
  const rows = await selectRows(transaction, "SELECT 1 FROM sites WHERE id = $1 AND company_id = $2", [
    siteId,
    user.companyId,
  ]);
  if (rows.length === 0)
    throw new AppError("invalid_input", "Choose one of your shop's sites", [
      { path: "body.siteId", message: "unknown site" },
    ]);
}

/** The shop's row is locked first, so two sets saved at once cannot both pass the count. */
async function assertRoomForAnotherSet(user: SignedInUser, transaction: Transaction) {
  await selectRows(transaction, "SELECT id FROM companies WHERE id = $1 FOR UPDATE", [user.companyId]);
  const [row] = await selectRows<{ count: number }>(
    transaction,
    "SELECT count(*)::int AS count FROM requirement_sets WHERE company_id = $1 AND active",
    [user.companyId],
  );
  if ((row?.count ?? 0) >= MAX_ACTIVE_REQUIREMENT_SETS_PER_SHOP)
    throw new AppError(
      "invalid_input",
      `A shop keeps at most ${MAX_ACTIVE_REQUIREMENT_SETS_PER_SHOP} active requirement sets; archive one you no longer use first`,
      [{ path: "body", message: `at most ${MAX_ACTIVE_REQUIREMENT_SETS_PER_SHOP} active sets` }],
    );
}

/** Saves a new set and stores every technician's standing against it in the same transaction. */
export async function defineRequirementSet(user: SignedInUser, input: RequirementSetInput) {
  const set = await db().transaction(async (transaction) => {
    await assertKnownTypeCodes(input.requirements, transaction);
    await assertOwnSite(user, input.siteId, transaction);
    await assertRoomForAnotherSet(user, transaction);
    const created = await RequirementSet.create(
      {
        companyId: user.companyId,
        siteId: input.siteId ?? null,
        name: input.name,
        requirements: input.requirements,
      },
      { transaction },
    );
    await refreshStandingsForRequirementSet(created.id, transaction);
    await recordAudit(
      {
        actorUserId: user.id,
        action: "requirement_set.defined",
        subjectType: "requirement_set",
        subjectId: created.id,
        after: input,
      },
      transaction,
    );
    return created;
  });
  return toRequirementSetDto(set);
}

export async function reviseRequirementSet(user: SignedInUser, id: number, input: RequirementSetInput) {
  const set = await db().transaction(async (transaction) => {
    await assertKnownTypeCodes(input.requirements, transaction);
    const existing = await RequirementSet.findOne({
      where: { id, companyId: user.companyId, active: true },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (!existing) throw notFound("That requirement set");
    await assertOwnSite(user, input.siteId, transaction);
    const before = existing.toJSON();
    await existing.update(
      { siteId: input.siteId ?? null, name: input.name, requirements: input.requirements },
      { transaction },
    );
    await refreshStandingsForRequirementSet(existing.id, transaction);
    await recordAudit(
      {
        actorUserId: user.id,
        action: "requirement_set.revised",
        subjectType: "requirement_set",
        subjectId: id,
        before,
        after: input,
      },
      transaction,
    );
    return existing;
  });
  return toRequirementSetDto(set);
}

/** Archives (never deletes) a set; its stored standings go, so nothing filters on a set no longer in use. */
export async function archiveRequirementSet(user: SignedInUser, id: number) {
  const set = await db().transaction(async (transaction) => {
    const existing = await RequirementSet.findOne({
      where: { id, companyId: user.companyId },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (!existing) throw notFound("That requirement set");
    await existing.update({ active: false }, { transaction });
    await dropStandingsForRequirementSet(id, transaction);
    await recordAudit(
      {
        actorUserId: user.id,
        action: "requirement_set.archived",
        subjectType: "requirement_set",
        subjectId: id,
      },
      transaction,
    );
    return existing;
  });
  return toRequirementSetDto(set);
}

function tally(standings: Standing[]): RequirementSetPreviewDto {
  const cleared = standings.filter((s) => s === "cleared").length;
  const lapsing = standings.filter((s) => s === "lapsing").length;
  return {
    technicians: standings.length,
    cleared,
    lapsing,
    notCleared: standings.length - cleared - lapsing,
    meeting: cleared + lapsing,
  };
}

/** A saved set: read from the stored standings (the indexed column the directory uses). */
export async function previewRequirementSet(
  user: SignedInUser,
  id: number,
): Promise<RequirementSetPreviewDto> {
  const set = await findOwnSet(user, id);
  return db().transaction(async (transaction) => {
    const rows = await selectRows<{ standing: Standing }>(
      transaction,
      `SELECT s.standing FROM technician_standings s JOIN technicians t ON t.id = s.technician_id
        WHERE s.requirement_set_id = $1 AND t.active`,
      [set.id],
    );
    return tally(rows.map((r) => r.standing));
  });
}

/**
 * An unsaved set from the form, as the daily job would store it. SQL first narrows to the active technicians who hold,
 * for every requirement, a verified credential of one of its types that has not lapsed (the only kind that can meet a
 * requirement), and loads just those credentials; the shared engine then decides cleared or lapsing for that short list.
 * Everyone else is not cleared without being looked at.
 */
export async function previewUnsavedRequirementSet(
  input: RequirementSetInput,
  asOf = new Date(),
): Promise<RequirementSetPreviewDto> {
  return db().transaction(async (transaction) => {
    await assertKnownTypeCodes(input.requirements, transaction);
    const types = await loadCredentialTypes(transaction);
    const bind: unknown[] = [asOf];
    const inForce = (holder: string, codes: string[]) => {
      bind.push(codes);
      return `EXISTS (SELECT 1 FROM credentials cr WHERE ${holder} AND cr.type_code = ANY($${bind.length}::text[])
        AND cr.state = 'verified' AND (cr.lapses_at IS NULL OR cr.lapses_at > $1))`;
    };
    const everyRequirement = input.requirements
      .map(
        (r) =>
          `(${inForce("cr.technician_id = t.id", r.typeCodes)}
            OR ${inForce("cr.company_id = t.company_id AND cr.technician_id IS NULL", r.typeCodes)})`,
      )
      .join(" AND ");
    // In turn: the transaction's one connection runs one statement at a time.
    const total = await selectRows<{ count: number }>(
      transaction,
      "SELECT count(*)::int AS count FROM technicians WHERE active",
    );
    const candidates = await selectRows<{ id: number; company_id: number; time_zone: string }>(
      transaction,
      `SELECT t.id, t.company_id, co.time_zone FROM technicians t JOIN companies co ON co.id = t.company_id
        WHERE t.active AND ${everyRequirement}`,
      bind,
    );
    const technicians = candidates.map((c) => ({ id: c.id, companyId: c.company_id, timeZone: c.time_zone }));
    const rows = technicians.length
      ? await selectRows<StandingCredentialRow>(
          transaction,
          `SELECT id, type_code, company_id, technician_id, state, fields FROM credentials
            WHERE type_code = ANY($2::text[]) AND state = 'verified' AND (lapses_at IS NULL OR lapses_at > $1)
              AND ((technician_id IS NULL AND company_id = ANY($3::int[])) OR technician_id = ANY($4::int[]))`,
          [
            asOf,
            [...new Set(input.requirements.flatMap((r) => r.typeCodes))],
            [...new Set(technicians.map((t) => t.companyId))],
            technicians.map((t) => t.id),
          ],
        )
      : [];
    const companyCredentials = new Map<number, StandingCredential[]>();
    const technicianCredentials = new Map<number, StandingCredential[]>();
    for (const row of rows) {
      const credential = toStandingCredential(row, types);
      if (!credential) continue;
      const [map, key] =
        row.technician_id === null
          ? [companyCredentials, row.company_id]
          : [technicianCredentials, row.technician_id];
      map.set(key, [...(map.get(key) ?? []), credential]);
    }
    const { cleared, lapsing } = countMeeting({
      requirements: input.requirements,
      technicians,
      companyCredentials,
      technicianCredentials,
      types,
      asOf,
      warningDays: lapsingWindowDays(),
    });
    const count = total[0]?.count ?? 0;
    return {
      technicians: count,
      cleared,
      lapsing,
      meeting: cleared + lapsing,
      notCleared: count - cleared - lapsing,
    };
  });
}
