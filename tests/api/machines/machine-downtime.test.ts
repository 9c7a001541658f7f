import { describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { sequelize, useTestApp } from "../../support/test-app.ts";
import { buildProvider } from "../../support/build-provider.ts";
import { acceptBody, buildWorkOrderWorld, raiseBody } from "../../fixtures/build-work-order-world.ts";
import {
  buildClearedCompany,
  buildShop,
  estimateBody,
  onlyInvite,
  raiseRequest,
} from "../../fixtures/build-service-request-world.ts";
import { buildMachineShop, machineBody, nextMachineSerial } from "../../fixtures/build-machine-shop.ts";

const t = useTestApp();

interface PeriodRow {
  started_at: Date;
  ended_at: Date | null;
  opened_by: string;
  closed_by: string | null;
  service_request_id: number | null;
  work_order_id: number | null;
  closed_work_order_id: number | null;
}

const periodsOf = (machineId: number) =>
  sequelize().query<PeriodRow>(
    `SELECT started_at, ended_at, opened_by, closed_by, service_request_id, work_order_id, closed_work_order_id
       FROM machine_downtime WHERE equipment_id = $1 ORDER BY started_at, id`,
    { bind: [machineId], type: QueryTypes.SELECT },
  );
const stateOf = async (machineId: number) =>
  (
    await sequelize().query<{ state: string }>("SELECT state FROM equipment WHERE id = $1", {
      bind: [machineId],
      type: QueryTypes.SELECT,
    })
  )[0]?.state;
const hoursAgo = (hours: number) => new Date(Date.now() - hours * 3_600_000).toISOString();
const tenths = (ms: number) => Math.round((ms / 3_600_000) * 10) / 10;

describe("machine downtime", () => {
  it("a work order raised for a machine that is down opens a period, and confirming the work ends it at completion", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const raised = await world.shop.agent.post("/api/work-orders").send(raiseBody(world)).expect(201);
    const id = raised.body.id as number;
    const whileDown = await periodsOf(world.equipmentId);
    const stateWhileDown = await stateOf(world.equipmentId);
    await world.provider.admin.post(`/api/work-orders/${id}/accept`).send(acceptBody()).expect(200);
    await world.provider.admin
      .post(`/api/work-orders/${id}/complete`)
      .send({ hoursWorked: 3, travelHours: 1, note: "Replaced the spindle drive fuse." })
      .expect(200);
    await world.shop.agent.post(`/api/work-orders/${id}/confirm`).send({}).expect(200);

    expect(stateWhileDown).toBe("down");
    expect(whileDown).toEqual([
      expect.objectContaining({ opened_by: "work_order", work_order_id: id, ended_at: null }),
    ]);
    const [order] = await sequelize().query<{
      created_at: Date;
      arrival_at: Date;
      completed_at: Date;
    }>("SELECT created_at, arrival_at, completed_at FROM work_orders WHERE id = $1", {
      bind: [id],
      type: QueryTypes.SELECT,
    });
    const [period] = await periodsOf(world.equipmentId);
    expect(await stateOf(world.equipmentId)).toBe("running");
    expect(period).toMatchObject({ closed_by: "confirmation", closed_work_order_id: id });
    expect(new Date(period!.started_at).getTime()).toBe(new Date(order!.created_at).getTime());
    expect(new Date(period!.ended_at!).getTime()).toBe(new Date(order!.completed_at).getTime());

    const panel = await world.shop.agent.get(`/api/machines/${world.equipmentId}/downtime`).expect(200);
    expect(panel.body).toMatchObject({
      machineId: world.equipmentId,
      timeZone: "America/Chicago",
      periods: 1,
    });
    expect(panel.body.months).toHaveLength(12);
    expect(panel.body.downSince).toBeNull();
    // The arrival agreed at acceptance (tomorrow morning) comes after the work was completed in this test: the
    // response runs from the call to that arrival, and a repair time running backwards is left out.
    expect(panel.body.companies).toEqual([
      {
        companyId: world.provider.company.id,
        companyName: expect.any(String),
        workOrders: 1,
        medianResponseHours: tenths(
          new Date(order!.arrival_at).getTime() - new Date(order!.created_at).getTime(),
        ),
        medianRepairHours: null,
      },
    ]);
  });

  it("a request for a machine that is down opens one period, a second request keeps it, and the confirmed work ends it", async () => {
    const shop = await buildShop(t.app);
    const company = await buildClearedCompany(t.app);
    const first = await raiseRequest(shop, await onlyInvite(shop, [company.company.id]));
    const second = await raiseRequest(shop, await onlyInvite(shop, [company.company.id]));
    const open = await periodsOf(shop.equipmentId);
    const panelDown = await shop.agent.get(`/api/machines/${shop.equipmentId}/downtime`).expect(200);

    const estimate = await company.admin
      .post(`/api/service-requests/${first.id}/estimates`)
      .send(estimateBody(company))
      .expect(201);
    const accepted = await shop.agent
      .post(`/api/service-requests/${first.id}/estimates/${estimate.body.estimates[0].id}/accept`)
      .expect(200);
    const workOrderId = accepted.body.workOrderId as number;
    const afterAccept = await periodsOf(shop.equipmentId);
    await company.admin
      .post(`/api/work-orders/${workOrderId}/complete`)
      .send({ hoursWorked: 2, travelHours: 1, note: "Reset the drive and replaced the fuse." })
      .expect(200);
    await shop.agent.post(`/api/work-orders/${workOrderId}/confirm`).send({}).expect(200);

    expect(second.id).not.toBe(first.id);
    expect(open).toEqual([
      expect.objectContaining({ opened_by: "service_request", service_request_id: first.id, ended_at: null }),
    ]);
    expect(panelDown.body.downSince).toBe(new Date(open[0]!.started_at).toISOString());
    expect(afterAccept).toHaveLength(1);
    const closed = await periodsOf(shop.equipmentId);
    expect(closed).toEqual([
      expect.objectContaining({ closed_by: "confirmation", closed_work_order_id: workOrderId }),
    ]);
    expect(await stateOf(shop.equipmentId)).toBe("running");
    const panel = await shop.agent.get(`/api/machines/${shop.equipmentId}/downtime`).expect(200);
    const [invite] = await sequelize().query<{ invited_at: Date }>(
      "SELECT invited_at FROM service_request_invitations WHERE request_id = $1 AND company_id = $2",
      { bind: [first.id, company.company.id], type: QueryTypes.SELECT },
    );
    const [order] = await sequelize().query<{ accepted_at: Date; arrival_at: Date | null }>(
      "SELECT accepted_at, arrival_at FROM work_orders WHERE id = $1",
      { bind: [workOrderId], type: QueryTypes.SELECT },
    );
    const onSite = new Date(order!.arrival_at ?? order!.accepted_at).getTime();
    expect(panel.body.companies).toEqual([
      expect.objectContaining({
        companyId: company.company.id,
        workOrders: 1,
        // Called when invited to the request, not when the shop accepted the estimate.
        medianResponseHours: tenths(onSite - new Date(invite!.invited_at).getTime()),
      }),
    ]);
  });

  it("marks a machine down and running again by hand, at times the shop gives, and refuses times that cannot be", async () => {
    const shop = await buildMachineShop(t.app);
    const base = `/api/machines/${shop.machineId}/running-state`;
    const down = await shop.agent.post(base).send({ state: "down", at: hoursAgo(5) });
    const twice = await shop.agent.post(base).send({ state: "down" });
    const ahead = await shop.agent.post(base).send({ state: "running", at: hoursAgo(-2) });
    const beforeStart = await shop.agent.post(base).send({ state: "running", at: hoursAgo(6) });
    const tooOld = await shop.agent.post(base).send({ state: "running", at: hoursAgo(24 * 15) });
    const notAnInstant = await shop.agent.post(base).send({ state: "running", at: "yesterday" });
    const unknownState = await shop.agent.post(base).send({ state: "broken" });
    const running = await shop.agent.post(base).send({ state: "running", at: hoursAgo(1) });
    const again = await shop.agent.post(base).send({ state: "running" });
    const overlapping = await shop.agent.post(base).send({ state: "down", at: hoursAgo(3) });

    expect(down.status).toBe(200);
    expect(down.body.downSince).not.toBeNull();
    expect(twice.status).toBe(409);
    for (const refused of [ahead, beforeStart, tooOld, notAnInstant]) {
      expect(refused.status).toBe(422);
      expect(refused.body.error.fields).toContainEqual(expect.objectContaining({ path: "body.at" }));
    }
    expect(unknownState.status).toBe(422);
    expect(unknownState.body.error.fields).toContainEqual(expect.objectContaining({ path: "body.state" }));
    expect(running.status).toBe(200);
    expect(running.body.downSince).toBeNull();
    expect(running.body.totalHours).toBeCloseTo(4, 1);
    expect(running.body.recent).toEqual([
      expect.objectContaining({ openedBy: "hand", closedBy: "hand", endedAt: expect.any(String) }),
    ]);
    expect(again.status).toBe(409);
    expect(overlapping.status).toBe(422);
    expect(await stateOf(shop.machineId)).toBe("running");
    const audit = await sequelize().query<{ action: string }>(
      "SELECT action FROM audit_events WHERE subject_type = 'equipment' AND subject_id = $1 AND action LIKE 'machine.%' ORDER BY id",
      { bind: [shop.machineId], type: QueryTypes.SELECT },
    );
    expect(audit.map((a) => a.action)).toEqual(["machine.down", "machine.running"]);
  });

  it("follows the state written on the machine form: into down opens a period, out of down ends it", async () => {
    const shop = await buildMachineShop(t.app, { machine: false });
    const serial = nextMachineSerial();
    const added = await shop.agent
      .post(`/api/sites/${shop.siteId}/equipment`)
      .send({ ...machineBody(serial), state: "down" })
      .expect(201);
    const id = added.body.id as number;
    const opened = await periodsOf(id);
    await shop.agent
      .put(`/api/sites/${shop.siteId}/equipment/${id}`)
      .send({ ...machineBody(serial), state: "out_of_service" })
      .expect(200);
    const outOfService = await shop.agent.post(`/api/machines/${id}/running-state`).send({ state: "down" });

    expect(opened).toEqual([expect.objectContaining({ opened_by: "hand", ended_at: null })]);
    expect(await periodsOf(id)).toEqual([
      expect.objectContaining({ closed_by: "hand", ended_at: expect.any(Date) }),
    ]);
    // A machine taken out of service is not expected to run, so it is not "down" either.
    expect(outOfService.status).toBe(409);
  });

  it("a work order that was not raised for a stoppage leaves a down machine down when it is confirmed", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = (
      await world.shop.agent
        .post("/api/work-orders")
        .send(raiseBody(world, { urgency: "normal", problem: "Replace the worn way wipers." }))
        .expect(201)
    ).body.id as number;
    await world.shop.agent
      .post(`/api/machines/${world.equipmentId}/running-state`)
      .send({ state: "down" })
      .expect(200);
    await world.provider.admin.post(`/api/work-orders/${id}/accept`).send(acceptBody()).expect(200);
    await world.provider.admin
      .post(`/api/work-orders/${id}/complete`)
      .send({ hoursWorked: 1, travelHours: 1, note: "Wipers replaced." })
      .expect(200);
    await world.shop.agent.post(`/api/work-orders/${id}/confirm`).send({}).expect(200);

    expect(await stateOf(world.equipmentId)).toBe("down");
    expect(await periodsOf(world.equipmentId)).toEqual([expect.objectContaining({ ended_at: null })]);
  });

  it("answers only the shop whose site holds the machine", async () => {
    const owner = await buildMachineShop(t.app);
    const other = await buildMachineShop(t.app, { machine: false });
    const provider = await buildProvider(t.app);
    const base = `/api/machines/${owner.machineId}`;

    const foreignRead = await other.agent.get(`${base}/downtime`);
    const foreignMark = await other.agent.post(`${base}/running-state`).send({ state: "down" });
    const providerRead = await provider.admin.get(`${base}/downtime`);

    expect(foreignRead.status).toBe(404);
    expect(foreignMark.status).toBe(404);
    expect(providerRead.status).toBe(403);
    expect(await periodsOf(owner.machineId)).toEqual([]);
  });
});
