import type { BaselineDto, BaselineInput } from "../../shared/standing/schemas.ts";
import { recordAudit } from "../audit/index.ts";
import { db } from "../db/sequelize.ts";
import type { SignedInUser } from "../http/policy.ts";
import { PlatformBaseline } from "./model.ts";
import { refreshAllStandings } from "./refresh-standing.ts";
import { assertKnownTypeCodes } from "./requirement-types-check.ts";

export async function readBaseline(): Promise<BaselineDto> {
  const row = await PlatformBaseline.findByPk(1);
  if (!row) throw new Error("platform_baseline row is missing: run the migrations");
  return { requirements: row.requirements, updatedAt: row.updatedAt.toISOString() };
}

/** Replaces what every technician must meet and recomputes every stored standing in the same transaction. */
export async function reviseBaseline(user: SignedInUser, input: BaselineInput): Promise<BaselineDto> {
  await db().transaction(async (transaction) => {
    await assertKnownTypeCodes(input.requirements, transaction);
    const row = await PlatformBaseline.findByPk(1, { transaction, lock: transaction.LOCK.UPDATE });
    const before = row?.requirements ?? null;
    await PlatformBaseline.upsert(
      { id: 1, requirements: input.requirements, updatedBy: user.id },
      { transaction },
    );
    await refreshAllStandings(new Date(), transaction);
    await recordAudit(
      {
        actorUserId: user.id,
        action: "baseline.revised",
        subjectType: "platform_baseline",
        subjectId: 1,
        before,
        after: input.requirements,
      },
      transaction,
    );
  });
  return readBaseline();
}
