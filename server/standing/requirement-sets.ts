import type { RequirementSetInput, RequirementSetPreviewDto } from "../../shared/standing/schemas.ts";
import type { Standing } from "../../shared/standing/standing-types.ts";
import { recordAudit } from "../audit/index.ts";
import { db } from "../db/sequelize.ts";
import { notFound } from "../http/app-error.ts";
import type { SignedInUser } from "../http/policy.ts";
import { computeStandings } from "./compute-stored-standings.ts";
import { toRequirementSetDto } from "./dto.ts";
import { RequirementSet } from "./model.ts";
import { dropStandingsForRequirementSet, refreshStandingsForRequirementSet } from "./refresh-standing.ts";
import { assertKnownTypeCodes } from "./requirement-types-check.ts";
import { loadStandingInputs } from "./standing-inputs.ts";
import { selectRows } from "./sql.ts";

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

/** Saves a new set and stores every technician's standing against it in the same transaction. */
export async function defineRequirementSet(user: SignedInUser, input: RequirementSetInput) {
  const set = await db().transaction(async (transaction) => {
    await assertKnownTypeCodes(input.requirements, transaction);
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

/** An unsaved set from the form: every active technician evaluated in memory, now. */
export async function previewUnsavedRequirementSet(
  input: RequirementSetInput,
  asOf = new Date(),
): Promise<RequirementSetPreviewDto> {
  return db().transaction(async (transaction) => {
    await assertKnownTypeCodes(input.requirements, transaction);
    const inputs = await loadStandingInputs("all", transaction, {
      targets: [{ id: -1, name: input.name, requirements: input.requirements }],
    });
    const active = inputs.technicians.filter((t) => t.active);
    return tally(computeStandings(inputs, asOf, active).map((s) => s.standing));
  });
}
