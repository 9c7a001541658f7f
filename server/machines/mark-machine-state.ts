import { QueryTypes } from "sequelize";
import type { MarkMachineState } from "../../shared/machines/downtime-schemas.ts";
import { db } from "../db/sequelize.ts";
import { AppError } from "../http/app-error.ts";
import { followStateChange } from "./downtime.ts";

/** How far back a shop may say a change happened: long enough for a weekend, short enough to stay a real record. */
export const MARK_BACKDATE_DAYS = 14;
/** Clock difference allowed between the shop's browser and the server. */
const CLOCK_SLACK_MS = 5 * 60_000;

const refuseAt = (message: string) => new AppError("invalid_input", message, [{ path: "body.at", message }]);

/**
 * The shop says its machine stopped or runs again. Down is refused for a machine out of service or sold (it is not
 * expected to run), running for a machine that is not down; the instant may not be ahead, more than two weeks back, or
 * before the stoppage it ends (or the last one's end, for a new stoppage), so periods never overlap.
 */
export async function markMachineState(
  actor: Express.User,
  machineId: number,
  input: MarkMachineState,
  now: Date,
) {
  const at = input.at ? new Date(input.at) : now;
  if (at.getTime() > now.getTime() + CLOCK_SLACK_MS)
    throw refuseAt("That time is still ahead; give when it happened");
  if (at.getTime() < now.getTime() - MARK_BACKDATE_DAYS * 86_400_000)
    throw refuseAt(`Give a time within the last ${MARK_BACKDATE_DAYS} days`);
  await db().transaction(async (transaction) => {
    const [machine] = await db().query<{ state: string; last_start: Date | null; last_end: Date | null }>(
      `SELECT e.state,
              (SELECT max(started_at) FROM machine_downtime d WHERE d.equipment_id = e.id) AS last_start,
              (SELECT max(ended_at) FROM machine_downtime d WHERE d.equipment_id = e.id) AS last_end
         FROM equipment e WHERE e.id = $1 FOR UPDATE OF e`,
      { bind: [machineId], type: QueryTypes.SELECT, transaction },
    );
    if (!machine) throw new AppError("not_found", "That machine was not found");
    if (input.state === "down" && machine.state !== "running")
      throw new AppError(
        "conflict",
        `This machine is ${machine.state.replace(/_/g, " ")}; only a running one can be marked down`,
      );
    if (input.state === "running" && machine.state !== "down")
      throw new AppError("conflict", "This machine is not marked down");
    const bound = input.state === "down" ? machine.last_end : machine.last_start;
    if (bound && at.getTime() < new Date(bound).getTime())
      throw refuseAt(
        input.state === "down"
          ? "That is before the machine's last stoppage ended; give a later time"
          : "That is before the machine went down; give a later time",
      );
    await db().query("UPDATE equipment SET state = $2, updated_at = $3 WHERE id = $1", {
      bind: [machineId, input.state, now],
      transaction,
    });
    await followStateChange(machineId, machine.state, input.state, actor.id, at, transaction);
  });
}
