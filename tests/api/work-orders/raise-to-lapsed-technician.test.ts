import { afterEach, describe, expect, it, vi } from "vitest";
import { QueryTypes } from "sequelize";
import { sequelize, useTestApp } from "../../support/test-app.ts";
import {
  buildWorkOrderWorld,
  raiseBody,
  type WorkOrderWorld,
} from "../../fixtures/build-work-order-world.ts";
import { addCalendarDays } from "../../../shared/standing/iso-date.ts";
import { policyEndInstant } from "../../../shared/standing/policy-period.ts";

const t = useTestApp();
afterEach(() => {
  vi.useRealTimers();
});

// Yesterday's UTC date: its 12:01 a.m. standard-time cut-off in Chicago is always in the past, so the signed-in sessions
// stay valid while the clock is set back to it.
const yesterday = () => addCalendarDays(new Date().toISOString().slice(0, 10), -1);

/** The stored standing says cleared, as it would until the daily job or a decision runs again. */
async function storeClearedBaseline(world: WorkOrderWorld) {
  await sequelize().query(
    `INSERT INTO technician_standings (technician_id, requirement_set_id, standing, earliest_lapse, results, computed_at)
     VALUES ($1, NULL, 'cleared', NULL, '[]'::jsonb, CURRENT_TIMESTAMP - interval '2 days')
     ON CONFLICT (technician_id, (coalesce(requirement_set_id, 0))) DO UPDATE SET standing = 'cleared'`,
    { bind: [world.provider.technician.id], type: QueryTypes.INSERT },
  );
}

async function raiseAt(world: WorkOrderWorld, instant: Date) {
  vi.useFakeTimers({ toFake: ["Date"], now: instant });
  try {
    return await world.shop.agent.post("/api/work-orders").send(raiseBody(world));
  } finally {
    vi.useRealTimers();
  }
}

describe("raising a work order at the moment a policy lapses", () => {
  it("answers 409 naming the requirement when the general liability policy lapsed one second ago", async () => {
    const expirationDate = yesterday();
    const world = await buildWorkOrderWorld(t.app, { generalLiabilityExpires: expirationDate });
    await storeClearedBaseline(world);
    // The policy ends at 12:01 a.m. standard time at the insured's address on its expiration date (ISO CG DS 01 wording, from memory).
    const lapse = policyEndInstant(expirationDate, "America/Chicago");

    const res = await raiseAt(world, new Date(lapse.getTime() + 1000));

    expect(res.status).toBe(409);
    const general = res.body.error.fields.find((f: { message: string }) =>
      f.message.includes("General liability in force"),
    );
    expect(general.message).toContain("lapsed");
  });

  it("accepts the same request one second before the lapse (the technician is then lapsing, still cleared)", async () => {
    const expirationDate = yesterday();
    const world = await buildWorkOrderWorld(t.app, { generalLiabilityExpires: expirationDate });
    // A second before the lapse the stored standing still listed the technician, so the shop could find them.
    await storeClearedBaseline(world);
    const lapse = policyEndInstant(expirationDate, "America/Chicago");

    const res = await raiseAt(world, new Date(lapse.getTime() - 1000));

    expect(res.status).toBe(201);
    expect(res.body.status).toBe("requested");
  });
});
