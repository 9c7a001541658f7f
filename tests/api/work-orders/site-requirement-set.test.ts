import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { buildTestApp, sequelize, type TestApp } from "../../support/test-app.ts";
import {
  buildWorkOrderWorld,
  raiseBody,
  type WorkOrderWorld,
  acceptBody,
} from "../../fixtures/build-work-order-world.ts";

let t: TestApp;
let world: WorkOrderWorld;
let setId: number;
const LINE = "Site rule: general liability in force";

beforeAll(async () => {
  t = buildTestApp();
  world = await buildWorkOrderWorld(t.app);
  const rows = await sequelize().query<{ id: number }>(
    `INSERT INTO requirement_sets (company_id, site_id, name, requirements)
     SELECT s.company_id, s.id, 'Plant floor rules', $2::jsonb FROM sites s WHERE s.id = $1 RETURNING id`,
    {
      bind: [world.siteId, JSON.stringify([{ label: LINE, typeCodes: ["general_liability"] }])],
      type: QueryTypes.SELECT,
    },
  );
  setId = rows[0]!.id;
});
afterAll(() => t.close());

// Common practice: the proof a shop files for its auditor lists the rules of the site where the work happens.
describe("work order: the site's requirement set is carried", () => {
  it("applies the site's set when none is named, and the printable proof lists its lines", async () => {
    const raised = await world.shop.agent.post("/api/work-orders").send(raiseBody(world));
    expect(raised.status, JSON.stringify(raised.body)).toBe(201);
    expect(raised.body.requirementSet).toEqual({ id: setId, name: "Plant floor rules" });
    await world.provider.admin
      .post(`/api/work-orders/${raised.body.id}/accept`)
      .send(acceptBody())
      .expect(200);
    const proof = await world.shop.agent.get(`/api/work-orders/${raised.body.id}/standing-proof`);
    expect(proof.status).toBe(200);
    expect(proof.text).toContain("Plant floor rules");
    expect(proof.text).toContain(LINE);
  });

  it("keeps the platform baseline only when the buyer chose it explicitly (null)", async () => {
    const raised = await world.shop.agent
      .post("/api/work-orders")
      .send(raiseBody(world, { requirementSetId: null }));
    expect(raised.status, JSON.stringify(raised.body)).toBe(201);
    expect(raised.body.requirementSet).toBeNull();
  });
});
