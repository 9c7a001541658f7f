import { describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { sequelize, useTestApp } from "../../support/test-app.ts";
import { buildWorkOrderWorld, raiseBody } from "../../fixtures/build-work-order-world.ts";
import { addCalendarDays } from "../../../shared/standing/iso-date.ts";

const t = useTestApp();

const today = () => new Date().toISOString().slice(0, 10);

async function workOrdersOf(shopCompanyId: number) {
  const [row] = await sequelize().query<{ n: string }>(
    "SELECT count(*) AS n FROM work_orders WHERE shop_company_id = $1",
    { bind: [shopCompanyId], type: QueryTypes.SELECT },
  );
  return Number(row?.n);
}

describe("preferred visit dates", () => {
  it.each([
    ["1900-06-01", "Choose a date from today on"],
    ["2999-06-01", "Choose a date within 2 years"],
    [addCalendarDays(today(), -3), "Choose a date from today on"],
    [addCalendarDays(today(), 2 * 366 + 1), "Choose a date within 2 years"],
  ])("refuses %s with 422 and raises nothing", async (date, message) => {
    const world = await buildWorkOrderWorld(t.app);

    const res = await world.shop.agent
      .post("/api/work-orders")
      .send(raiseBody(world, { preferredDates: [addCalendarDays(today(), 1), date] }));

    expect(res.status).toBe(422);
    expect(res.body.error.fields).toEqual([{ path: "body.preferredDates.1", message }]);
    expect(await workOrdersOf(world.shop.company.id)).toBe(0);
  });

  it("accepts today and a date a year and a half ahead", async () => {
    const world = await buildWorkOrderWorld(t.app);

    const res = await world.shop.agent
      .post("/api/work-orders")
      .send(raiseBody(world, { preferredDates: [today(), addCalendarDays(today(), 540)] }));

    expect(res.status).toBe(201);
    expect(res.body.preferredDates).toEqual([today(), addCalendarDays(today(), 540)]);
  });
});
