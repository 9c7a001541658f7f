import { describe, expect, it } from "vitest";
import request from "supertest";
import { QueryTypes } from "sequelize";
import { sequelize, useTestApp } from "../../support/test-app.ts";
import { buildProvider, signedInAgent } from "../../support/build-provider.ts";
import {
  buildWorkOrderWorld,
  raiseBody,
  workOrderAt,
  acceptBody,
} from "../../fixtures/build-work-order-world.ts";
import { WorkOrder } from "../../../server/work-orders/model.ts";

const t = useTestApp();

describe("transitions refused for the wrong status", () => {
  it.each([
    ["accept", "accepted", acceptBody()],
    ["decline", "accepted", { reason: "Changed my mind" }],
    ["complete", "requested", { hoursWorked: 2, travelHours: 1 }],
    ["complete", "confirmed", { hoursWorked: 2, travelHours: 1 }],
  ] as const)(
    "answers 409 to %s on a %s work order and leaves it unchanged",
    async (action, status, body) => {
      const world = await buildWorkOrderWorld(t.app);
      const id = await workOrderAt(world, status);

      const res = await world.provider.admin.post(`/api/work-orders/${id}/${action}`).send(body);

      expect(res.status).toBe(409);
      expect((await WorkOrder.findByPk(id))!.status).toBe(status);
    },
  );

  it.each([
    ["cancel", "confirmed", "shop", { reason: "Too late to call it off" }],
    ["cancel", "declined", "shop", { reason: "Too late to call it off" }],
    ["cancel", "cancelled", "shop", { reason: "Cancelling it twice" }],
    ["confirm", "cancelled", "shop", {}],
    ["dispute", "confirmed", "shop", { reason: "Changed our minds later" }],
    ["accept", "cancelled", "admin", acceptBody()],
    ["complete", "cancelled", "admin", { hoursWorked: 2, travelHours: 1 }],
  ] as const)(
    "answers 409 to %s on a %s work order (the state machine in shared/work-orders) and leaves it unchanged",
    async (action, status, who, body) => {
      const world = await buildWorkOrderWorld(t.app);
      const id = await workOrderAt(world, status);
      const agent = who === "shop" ? world.shop.agent : world.provider.admin;

      const res = await agent.post(`/api/work-orders/${id}/${action}`).send(body);

      expect(res.status).toBe(409);
      expect((await WorkOrder.findByPk(id))!.status).toBe(status);
    },
  );

  it("answers 409 to confirming a work order that is not completed yet", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "accepted");

    const res = await world.shop.agent.post(`/api/work-orders/${id}/confirm`).send({});

    expect(res.status).toBe(409);
  });

  it("lets only one of two simultaneous accepts through", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "requested");

    const results = await Promise.all([
      world.provider.admin.post(`/api/work-orders/${id}/accept`).send(acceptBody()),
      world.provider.tech.post(`/api/work-orders/${id}/decline`).send({ reason: "Too far this week" }),
    ]);

    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
  });
});

describe("transitions refused for the wrong side", () => {
  it("answers 403 when the buyer tries to accept or complete", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const requested = await workOrderAt(world, "requested");
    const accepted = await workOrderAt(world, "accepted");

    const accept = await world.shop.agent.post(`/api/work-orders/${requested}/accept`).send(acceptBody());
    const complete = await world.shop.agent
      .post(`/api/work-orders/${accepted}/complete`)
      .send({ hoursWorked: 1, travelHours: 1 });

    expect(accept.status).toBe(403);
    expect(complete.status).toBe(403);
  });

  it("answers 403 when the service company tries to confirm its own work", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "completed");

    const res = await world.provider.admin.post(`/api/work-orders/${id}/confirm`).send({});

    expect(res.status).toBe(403);
  });

  it("answers 404 to another shop's buyer, another service company and its technician, as for a missing work order", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "requested");
    const otherShop = await signedInAgent(t.app, "shop", "buyer");
    const otherProvider = await buildProvider(t.app);

    const responses = await Promise.all([
      otherShop.agent.get(`/api/work-orders/${id}`),
      otherProvider.admin.post(`/api/work-orders/${id}/accept`).send(acceptBody()),
      otherProvider.tech.get(`/api/work-orders/${id}/messages`),
      world.shop.agent.get("/api/work-orders/2147483000"),
    ]);

    expect(responses.map((r) => r.status)).toEqual([404, 404, 404, 404]);
  });

  it("answers 403 to a reviewer or an admin, and 401 when signed out", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "requested");
    const reviewer = await signedInAgent(t.app, "platform", "reviewer");
    const admin = await signedInAgent(t.app, "platform", "admin");

    const byReviewer = await reviewer.agent.get(`/api/work-orders/${id}`);
    const byAdmin = await admin.agent.get("/api/work-orders");
    const anonymous = await request(t.app).get(`/api/work-orders/${id}`);

    expect(byReviewer.status).toBe(403);
    expect(byAdmin.status).toBe(403);
    expect(anonymous.status).toBe(401);
  });
});

describe("raising a work order", () => {
  it("is for buyers only", async () => {
    const world = await buildWorkOrderWorld(t.app);

    const res = await world.provider.admin.post("/api/work-orders").send(raiseBody(world));

    expect(res.status).toBe(403);
  });

  it("answers 422 naming each field that breaks its rule", async () => {
    const world = await buildWorkOrderWorld(t.app);

    const res = await world.shop.agent
      .post("/api/work-orders")
      .send(raiseBody(world, { problem: "hm", urgency: "asap", preferredDates: ["2026-02-30"] }));

    expect(res.status).toBe(422);
    const paths = res.body.error.fields.map((f: { path: string }) => f.path);
    expect(paths).toEqual(expect.arrayContaining(["body.problem", "body.urgency", "body.preferredDates.0"]));
  });

  it("refuses another shop's site, a machine from another site and another shop's requirement set", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const other = await buildWorkOrderWorld(t.app);
    const [foreignSet] = await sequelize().query<{ id: number }>(
      "INSERT INTO requirement_sets (company_id, name, requirements) VALUES ($1, 'Spindle work', $2::jsonb) RETURNING id",
      {
        bind: [
          other.shop.company.id,
          JSON.stringify([{ label: "General liability", typeCodes: ["general_liability"] }]),
        ],
        type: QueryTypes.SELECT,
      },
    );

    const foreignSite = await world.shop.agent
      .post("/api/work-orders")
      .send(raiseBody(world, { siteId: other.siteId, equipmentId: undefined, technology: "mill" }));
    const foreignMachine = await world.shop.agent
      .post("/api/work-orders")
      .send(raiseBody(world, { equipmentId: other.equipmentId }));
    const foreignSetRes = await world.shop.agent
      .post("/api/work-orders")
      .send(raiseBody(world, { requirementSetId: foreignSet!.id }));

    expect(foreignSite.status).toBe(422);
    expect(foreignSite.body.error.fields[0].path).toBe("body.siteId");
    expect(foreignMachine.status).toBe(422);
    expect(foreignMachine.body.error.fields[0].path).toBe("body.equipmentId");
    expect(foreignSetRes.status).toBe(422);
    expect(foreignSetRes.body.error.fields[0].path).toBe("body.requirementSetId");
  });

  it("refuses a technician the directory does not list exactly like an unknown one, naming no reason", async () => {
    const world = await buildWorkOrderWorld(t.app);
    // No verified insurance at all: never cleared, so never shown to shops.
    const bare = await buildProvider(t.app);

    const res = await world.shop.agent
      .post("/api/work-orders")
      .send(raiseBody(world, { technicianId: bare.technician.id }));
    const unknown = await world.shop.agent
      .post("/api/work-orders")
      .send(raiseBody(world, { technicianId: 99999999 }));

    expect(res.status).toBe(422);
    expect(res.body).toEqual(unknown.body);
    expect(JSON.stringify(res.body)).not.toContain("Workers' compensation");
  });
});
