import { describe, expect, it } from "vitest";
import request from "supertest";
import { QueryTypes } from "sequelize";
import { sequelize, useTestApp } from "../../support/test-app.ts";
import {
  buildClearedCompany,
  buildShop,
  estimateBody,
  type Shop,
} from "../../fixtures/build-service-request-world.ts";
import { calendarDateIn } from "../../../shared/dates/local-time.ts";
import { addCalendarDays } from "../../../shared/standing/iso-date.ts";
import { addCalendarMonths } from "../../../shared/standing/training-validity.ts";
import { maintenanceWindow } from "../../../shared/machines/maintenance-due.ts";

const t = useTestApp();

const SITE_ZONE = "America/Chicago";
const todayAtSite = () => calendarDateIn(new Date(), SITE_ZONE);

async function rows<T extends object>(sql: string, bind: unknown[]) {
  return sequelize().query<T>(sql, { bind, type: QueryTypes.SELECT });
}

const annual = (lastDoneOn: string) => ({
  name: "Annual inspection",
  intervalKind: "months",
  intervalMonths: 12,
  lastDoneOn,
});

async function addPlan(shop: Shop, body: Record<string, unknown>) {
  const res = await shop.agent.post(`/api/machines/${shop.equipmentId}/maintenance-plans`).send(body);
  if (res.status !== 201) throw new Error(`add plan failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as { id: number; due: { dueOn: string; daysUntil: number; dueKey: string } };
}

describe("maintenance plans on a machine", () => {
  it("adds, lists, changes and removes a plan, with the next due date worked out on the server", async () => {
    const shop = await buildShop(t.app);
    const lastDoneOn = addCalendarMonths(todayAtSite(), -11);

    const added = await addPlan(shop, annual(lastDoneOn));
    const listed = await shop.agent.get(`/api/machines/${shop.equipmentId}/maintenance-plans`);
    const changed = await shop.agent
      .put(`/api/machines/${shop.equipmentId}/maintenance-plans/${added.id}`)
      .send({ ...annual(lastDoneOn), name: "Way lube and backlash check", intervalMonths: 6 });
    const removed = await shop.agent.delete(
      `/api/machines/${shop.equipmentId}/maintenance-plans/${added.id}`,
    );
    const after = await shop.agent.get(`/api/machines/${shop.equipmentId}/maintenance-plans`);

    // Calendar months with end-of-month clamping, as for training cards (common practice).
    expect(added.due.dueOn).toBe(addCalendarMonths(lastDoneOn, 12));
    expect(listed.status).toBe(200);
    expect(listed.body).toMatchObject({
      machineId: shop.equipmentId,
      siteTimeZone: SITE_ZONE,
      today: todayAtSite(),
    });
    expect(listed.body.plans).toEqual([expect.objectContaining({ id: added.id, name: "Annual inspection" })]);
    expect(changed.status).toBe(200);
    expect(changed.body.due.dueOn).toBe(addCalendarMonths(lastDoneOn, 6));
    expect(changed.body.due.state).toBe("overdue");
    expect(removed.status).toBe(204);
    expect(after.body.plans).toEqual([]);
    const audit = await rows<{ action: string }>(
      "SELECT action FROM audit_events WHERE subject_type = 'maintenance_plan' AND subject_id = $1 ORDER BY id",
      [added.id],
    );
    expect(audit.map((a) => a.action)).toEqual([
      "maintenance_plan.added",
      "maintenance_plan.changed",
      "maintenance_plan.removed",
    ]);
  });

  it("refuses a plan in months without its last service date, a future date and a control character, naming each field", async () => {
    const shop = await buildShop(t.app);
    const path = `/api/machines/${shop.equipmentId}/maintenance-plans`;

    const noDate = await shop.agent
      .post(path)
      .send({ name: "Ballbar test", intervalKind: "months", intervalMonths: 12 });
    const future = await shop.agent.post(path).send(annual(addCalendarDays(todayAtSite(), 2)));
    const nul = await shop.agent.post(path).send({ ...annual("2026-01-15"), name: "Ball\u0000bar" });
    const noHours = await shop.agent
      .post(path)
      .send({ name: "Spindle check", intervalKind: "hours", intervalHours: 2000 });
    const stored = await rows<{ n: number }>(
      "SELECT count(*)::int AS n FROM maintenance_plans WHERE equipment_id = $1",
      [shop.equipmentId],
    );

    expect(noDate.status).toBe(422);
    expect(noDate.body.error.fields).toContainEqual(expect.objectContaining({ path: "body.lastDoneOn" }));
    expect(future.status).toBe(422);
    expect(future.body.error.fields).toContainEqual(expect.objectContaining({ path: "body.lastDoneOn" }));
    expect(nul.status).toBe(422);
    expect(nul.body.error.fields).toContainEqual(expect.objectContaining({ path: "body.name" }));
    expect(noHours.status).toBe(422);
    expect(noHours.body.error.fields).toContainEqual(expect.objectContaining({ path: "body.lastDoneHours" }));
    expect(stored[0]!.n).toBe(0);
  });

  it("answers 404 to another shop and 403 to a service company for every maintenance route, and leaves the plan as it was", async () => {
    const shop = await buildShop(t.app);
    const other = await buildShop(t.app);
    const company = await buildClearedCompany(t.app);
    const plan = await addPlan(shop, annual("2026-02-10"));
    const base = `/api/machines/${shop.equipmentId}`;
    const calls = (agent: ReturnType<typeof request.agent>) => [
      agent.get(`${base}/maintenance-plans`),
      agent.post(`${base}/maintenance-plans`).send(annual("2026-02-10")),
      agent.put(`${base}/maintenance-plans/${plan.id}`).send({ ...annual("2026-02-10"), name: "Taken over" }),
      agent.delete(`${base}/maintenance-plans/${plan.id}`),
      agent.post(`${base}/hour-readings`).send({ hours: 100 }),
      agent.post(`${base}/maintenance-plans/${plan.id}/service-request`).send({}),
    ];

    const fromShop = await Promise.all(calls(other.agent));
    const fromCompany = await Promise.all(calls(company.admin));
    const anonymous = await request(t.app).get(`${base}/maintenance-plans`);
    const own = await shop.agent.get(`${base}/maintenance-plans`);

    expect(fromShop.map((r) => r.status)).toEqual([404, 404, 404, 404, 404, 404]);
    expect(fromCompany.map((r) => r.status)).toEqual([403, 403, 403, 403, 403, 403]);
    expect(anonymous.status).toBe(401);
    expect(own.body.plans).toEqual([expect.objectContaining({ id: plan.id, name: "Annual inspection" })]);
  });

  it("answers 404 for another machine's plan id under the shop's own machine", async () => {
    const shop = await buildShop(t.app);
    const other = await buildShop(t.app);
    const foreign = await addPlan(other, annual("2026-02-10"));

    const res = await shop.agent
      .put(`/api/machines/${shop.equipmentId}/maintenance-plans/${foreign.id}`)
      .send(annual("2026-02-10"));

    expect(res.status).toBe(404);
  });
});

describe("running hours", () => {
  it("keeps meter readings, refuses one that runs backwards, and projects the due date from the use", async () => {
    const shop = await buildShop(t.app);
    const today = todayAtSite();
    const base = `/api/machines/${shop.equipmentId}`;
    await shop.agent
      .post(`${base}/hour-readings`)
      .send({ hours: 8_000, readOn: addCalendarDays(today, -20) })
      .expect(201);
    await shop.agent.post(`${base}/hour-readings`).send({ hours: 8_200, readOn: today }).expect(201);

    const backwards = await shop.agent.post(`${base}/hour-readings`).send({ hours: 8_100 });
    const plan = await addPlan(shop, {
      name: "Spindle bearing check",
      intervalKind: "hours",
      intervalHours: 1_000,
      lastDoneHours: 7_900,
    });

    expect(backwards.status).toBe(422);
    expect(backwards.body.error.fields).toContainEqual(expect.objectContaining({ path: "body.hours" }));
    // 200 h in 20 days is 10 h a day; 700 h to go is 70 days (straight-line projection, common practice).
    expect(plan.due).toMatchObject({
      dueHours: 8_900,
      currentHours: 8_200,
      dueOn: addCalendarDays(today, 70),
      estimated: true,
      dueKey: "hours:8900",
    });
  });
});

async function raise(shop: Shop, planId: number, body: Record<string, unknown> = {}) {
  return shop.agent
    .post(`/api/machines/${shop.equipmentId}/maintenance-plans/${planId}/service-request`)
    .send(body);
}

describe("requesting the planned service", () => {
  it("raises a preventive-maintenance request for the machine with the window filled in, once per due date", async () => {
    const shop = await buildShop(t.app);
    await buildClearedCompany(t.app);
    const lastDoneOn = addCalendarDays(addCalendarMonths(todayAtSite(), -12), 20);
    const plan = await addPlan(shop, annual(lastDoneOn));

    const first = await raise(shop, plan.id);
    const second = await raise(shop, plan.id);
    const request = await shop.agent.get(`/api/service-requests/${first.body.serviceRequestId}`);
    const listed = await shop.agent.get(`/api/machines/${shop.equipmentId}/maintenance-plans`);

    const expected = maintenanceWindow(plan.due.dueOn, todayAtSite());
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject(expected);
    expect(second.status).toBe(409);
    expect(request.body).toMatchObject({
      kind: "preventive_maintenance",
      machineState: "planned",
      timing: "window",
      windowStart: expected.windowStart,
      windowEnd: expected.windowEnd,
    });
    // The kind travels as a field; the text starts with the plan so the work order does not say the kind twice.
    expect(request.body.problem).toMatch(/^Annual inspection \(every 12 months; last done /);
    expect(listed.body.plans[0].openRequest).toMatchObject({ serviceRequestId: first.body.serviceRequestId });
  });

  it("takes the buyer's own window and refuses one that ends before it starts", async () => {
    const shop = await buildShop(t.app);
    await buildClearedCompany(t.app);
    const plan = await addPlan(shop, annual("2026-01-20"));
    const start = addCalendarDays(todayAtSite(), 3);

    const backwards = await raise(shop, plan.id, {
      windowStart: start,
      windowEnd: addCalendarDays(start, -1),
    });
    const own = await raise(shop, plan.id, { windowStart: start, windowEnd: addCalendarDays(start, 4) });

    expect(backwards.status).toBe(422);
    expect(backwards.body.error.fields).toContainEqual(expect.objectContaining({ path: "body.windowEnd" }));
    expect(own.status).toBe(201);
    expect(own.body).toEqual({
      serviceRequestId: expect.any(Number),
      windowStart: start,
      windowEnd: addCalendarDays(start, 4),
    });
  });

  it("moves the plan's next due date when the resulting work order is confirmed", async () => {
    const shop = await buildShop(t.app);
    const company = await buildClearedCompany(t.app);
    const lastDoneOn = addCalendarDays(addCalendarMonths(todayAtSite(), -6), 10);
    const plan = await addPlan(shop, {
      ...annual(lastDoneOn),
      name: "Way lube and backlash check",
      intervalMonths: 6,
    });
    const raised = await raise(shop, plan.id);
    const requestId = raised.body.serviceRequestId as number;
    const estimate = await company.admin
      .post(`/api/service-requests/${requestId}/estimates`)
      .send(estimateBody(company));
    const accepted = await shop.agent.post(
      `/api/service-requests/${requestId}/estimates/${estimate.body.estimates[0].id}/accept`,
    );
    const workOrderId = accepted.body.workOrderId as number;
    // The accepted estimate is already an accepted work order.
    await company.admin
      .post(`/api/work-orders/${workOrderId}/complete`)
      .send({ hoursWorked: 3, travelHours: 1, note: "Lubed ways, backlash within spec." })
      .expect(200);

    const beforeConfirm = await shop.agent.get(`/api/machines/${shop.equipmentId}/maintenance-plans`);
    await shop.agent.post(`/api/work-orders/${workOrderId}/confirm`).send({}).expect(200);
    const afterConfirm = await shop.agent.get(`/api/machines/${shop.equipmentId}/maintenance-plans`);

    const doneOn = todayAtSite();
    expect(beforeConfirm.body.plans[0].lastDoneOn).toBe(lastDoneOn);
    expect(afterConfirm.body.plans[0]).toMatchObject({
      lastDoneOn: doneOn,
      due: expect.objectContaining({ dueOn: addCalendarMonths(doneOn, 6), state: "scheduled" }),
      openRequest: null,
    });
    const link = await rows<{ done_work_order_id: number }>(
      "SELECT done_work_order_id FROM maintenance_plan_requests WHERE service_request_id = $1",
      [requestId],
    );
    expect(link[0]?.done_work_order_id).toBe(workOrderId);
  });

  it("restarts a running-hours plan from the latest meter reading once its work is confirmed", async () => {
    const shop = await buildShop(t.app);
    const company = await buildClearedCompany(t.app);
    const base = `/api/machines/${shop.equipmentId}`;
    await shop.agent.post(`${base}/hour-readings`).send({ hours: 11_990 }).expect(201);
    const plan = await addPlan(shop, {
      name: "Spindle bearing check",
      intervalKind: "hours",
      intervalHours: 2_000,
      lastDoneHours: 10_000,
    });
    const requestId = (await raise(shop, plan.id)).body.serviceRequestId as number;
    const estimate = await company.admin
      .post(`/api/service-requests/${requestId}/estimates`)
      .send(estimateBody(company));
    const accepted = await shop.agent.post(
      `/api/service-requests/${requestId}/estimates/${estimate.body.estimates[0].id}/accept`,
    );
    const workOrderId = accepted.body.workOrderId as number;
    await company.admin
      .post(`/api/work-orders/${workOrderId}/complete`)
      .send({ hoursWorked: 4, travelHours: 1 })
      .expect(200);
    await shop.agent.post(`${base}/hour-readings`).send({ hours: 12_004 }).expect(201);

    await shop.agent.post(`/api/work-orders/${workOrderId}/confirm`).send({}).expect(200);
    const after = await shop.agent.get(`${base}/maintenance-plans`);

    expect(after.body.plans[0]).toMatchObject({
      lastDoneHours: 12_004,
      due: expect.objectContaining({ dueHours: 14_004, currentHours: 12_004, dueKey: "hours:14004" }),
      openRequest: null,
    });
  });
});
