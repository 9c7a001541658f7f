import { describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import request from "supertest";
import { sequelize, useTestApp } from "../../support/test-app.ts";
import { signedInAgent } from "../../support/build-provider.ts";
import {
  acceptBody,
  buildWorkOrderWorld,
  raiseBody,
  type WorkOrderWorld,
} from "../../fixtures/build-work-order-world.ts";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../../shared/api/error-body.ts";
import { AuditEvent } from "../../../server/audit/model.ts";
import { buildCertificatePdf } from "../../fixtures/build-certificate-pdf.ts";

const t = useTestApp();

/** Raises a work order on the world's machine and walks it to confirmed, with parts and a note at completion. */
async function confirmedOnMachine(world: WorkOrderWorld, extra: Record<string, unknown> = {}) {
  const raised = await world.shop.agent
    .post("/api/work-orders")
    .send(raiseBody(world, { kind: "repair", problemArea: "spindle", ...extra }))
    .expect(201);
  const id = raised.body.id as number;
  await world.provider.admin.post(`/api/work-orders/${id}/accept`).send(acceptBody()).expect(200);
  await world.provider.tech
    .post(`/api/work-orders/${id}/complete`)
    .send({
      hoursWorked: 3.5,
      travelHours: 1.25,
      note: "Replaced the drawbar spring and reset the clamp force.",
      partsUsed: [{ description: "Drawbar spring set", partNumber: "DS-40-7", quantity: 1 }],
    })
    .expect(200);
  await world.shop.agent.post(`/api/work-orders/${id}/confirm`).send({}).expect(200);
  return id;
}

const SHOP_RECORD = {
  performedOn: "2026-09-14",
  kind: "repair",
  problemArea: "spindle",
  serviceCompanyName: "Marrow Lane Spindle Rebuild",
  technicianName: "Odile Fenwright",
  hoursOnSite: 6,
  travelHours: 1.5,
  note: "Spindle rebuilt off site; bearings and seals replaced.",
  partsUsed: [{ description: "Spindle bearing set", quantity: 2 }],
};

async function ratingOf(technicianId: number) {
  const rows = await sequelize().query<{ review_count: number; star_sum: number }>(
    "SELECT review_count, star_sum FROM technician_ratings WHERE technician_id = $1",
    { bind: [technicianId], type: QueryTypes.SELECT },
  );
  return rows[0] ?? null;
}

describe("a machine's service history", () => {
  it("lists a confirmed work order with its date, kind, company, technician, hours, note, parts, attachment and standing snapshot", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await confirmedOnMachine(world);
    const { bytes } = await buildCertificatePdf({ seed: 31 });
    await world.provider.admin
      .post(`/api/work-orders/${id}/messages`)
      .field("body", "Service report attached")
      .attach("file", Buffer.from(bytes), "spring.pdf")
      .expect(201);

    const res = await world.shop.agent.get(`/api/machines/${world.equipmentId}/history`);

    expect(res.status).toBe(200);
    expect(res.body.entries).toHaveLength(1);
    const entry = res.body.entries[0];
    expect(entry).toMatchObject({
      source: "platform",
      workOrderId: id,
      kind: "repair",
      problemArea: "spindle",
      serviceCompanyName: world.provider.company.name,
      technicianName: world.provider.technician.name,
      hoursOnSite: 3.5,
      travelHours: 1.25,
      note: "Replaced the drawbar spring and reset the clamp force.",
      partsUsed: [{ description: "Drawbar spring set", partNumber: "DS-40-7", quantity: 1 }],
      repeatOf: null,
    });
    expect(entry.date).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    expect(entry.standingSnapshot).toMatchObject({ technicianId: world.provider.technician.id });
    expect(["cleared", "lapsing"]).toContain(entry.standingSnapshot.standing);
    expect(entry.attachments.map((a: { name: string }) => a.name)).toEqual(["spring.pdf"]);
  });

  it("keeps kind, problem area and parts on the work order, and refuses a nameless part with 422", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const raised = await world.shop.agent
      .post("/api/work-orders")
      .send(raiseBody(world, { kind: "repair", problemArea: "tool_changer" }))
      .expect(201);
    const id = raised.body.id as number;
    await world.provider.admin.post(`/api/work-orders/${id}/accept`).send(acceptBody()).expect(200);

    const nameless = await world.provider.tech
      .post(`/api/work-orders/${id}/complete`)
      .send({ hoursWorked: 2, travelHours: 1, partsUsed: [{ description: " ", quantity: 1 }] });
    const done = await world.provider.tech
      .post(`/api/work-orders/${id}/complete`)
      .send({ hoursWorked: 2, travelHours: 1, partsUsed: [{ description: "Gripper finger", quantity: 4 }] });

    expect(raised.body).toMatchObject({ kind: "repair", problemArea: "tool_changer", partsUsed: [] });
    expect(nameless.status).toBe(422);
    expect(JSON.stringify(nameless.body)).toContain("body.partsUsed.0.description");
    expect(done.status).toBe(200);
    expect(done.body.partsUsed).toEqual([{ description: "Gripper finger", quantity: 4 }]);
  });

  it("leaves out work orders that are not confirmed", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const raised = await world.shop.agent.post("/api/work-orders").send(raiseBody(world)).expect(201);
    await world.provider.admin
      .post(`/api/work-orders/${raised.body.id}/accept`)
      .send(acceptBody())
      .expect(200);
    await world.provider.tech
      .post(`/api/work-orders/${raised.body.id}/complete`)
      .send({ hoursWorked: 2, travelHours: 1 })
      .expect(200);

    const res = await world.shop.agent.get(`/api/machines/${world.equipmentId}/history`);

    expect(res.status).toBe(200);
    expect(res.body.entries).toEqual([]);
  });

  it("keeps work the shop records itself, marked as recorded by the shop, and audits it", async () => {
    const world = await buildWorkOrderWorld(t.app);

    const res = await world.shop.agent.post(`/api/machines/${world.equipmentId}/history`).send(SHOP_RECORD);

    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      source: "shop_record",
      workOrderId: null,
      date: "2026-09-14",
      serviceCompanyName: "Marrow Lane Spindle Rebuild",
      hoursOnSite: 6,
      partsUsed: [{ description: "Spindle bearing set", quantity: 2 }],
      standingSnapshot: null,
    });
    const audit = await AuditEvent.findAll({
      where: { action: "machine.service_recorded", subjectId: world.equipmentId },
    });
    expect(audit).toHaveLength(1);
  });

  it("never counts a shop's own record toward the technician's rating", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await confirmedOnMachine(world);
    await world.shop.agent
      .post(`/api/work-orders/${id}/review`)
      .send({ stars: 5, body: "Quick, careful and left the enclosure clean." })
      .expect(201);
    const before = await ratingOf(world.provider.technician.id);

    await world.shop.agent
      .post(`/api/machines/${world.equipmentId}/history`)
      .send({
        ...SHOP_RECORD,
        serviceCompanyName: world.provider.company.name,
        technicianName: world.provider.technician.name,
      })
      .expect(201);
    const after = await ratingOf(world.provider.technician.id);
    const profile = await world.shop.agent.get(`/api/directory/technicians/${world.provider.technician.id}`);

    expect(before).toEqual({ review_count: 1, star_sum: 5 });
    expect(after).toEqual(before);
    expect(profile.body.rating.count).toBe(1);
    const history = await world.shop.agent.get(`/api/machines/${world.equipmentId}/history`);
    expect(history.body.entries.map((e: { source: string }) => e.source).sort()).toEqual([
      "platform",
      "shop_record",
    ]);
  });

  it("flags a repeat fault: the same problem area on the same machine within 90 days (common practice)", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await confirmedOnMachine(world);
    const today = (await world.shop.agent.get(`/api/machines/${world.equipmentId}/history`)).body.entries[0]
      .date as string;
    const daysBefore = (n: number) =>
      new Date(Date.parse(`${today}T00:00:00Z`) - n * 86_400_000).toISOString().slice(0, 10);
    await world.shop.agent
      .post(`/api/machines/${world.equipmentId}/history`)
      .send({ ...SHOP_RECORD, performedOn: daysBefore(200) })
      .expect(201);
    await world.shop.agent
      .post(`/api/machines/${world.equipmentId}/history`)
      .send({ ...SHOP_RECORD, performedOn: daysBefore(40) })
      .expect(201);

    const res = await world.shop.agent.get(`/api/machines/${world.equipmentId}/history`);

    const entries = res.body.entries as { key: string; date: string; repeatOf: string | null }[];
    expect(entries.map((e) => e.date)).toEqual([today, daysBefore(40), daysBefore(200)]);
    expect(entries[0]!.key).toBe(`wo-${id}`);
    expect(entries[0]!.repeatOf).toBe(entries[1]!.key);
    // 160 days apart: outside the window.
    expect(entries[1]!.repeatOf).toBeNull();
  });

  it("refuses a record dated after today, and a missing note, with 422 naming the field", async () => {
    const world = await buildWorkOrderWorld(t.app);

    const future = await world.shop.agent
      .post(`/api/machines/${world.equipmentId}/history`)
      .send({ ...SHOP_RECORD, performedOn: "2099-01-01" });
    const noNote = await world.shop.agent
      .post(`/api/machines/${world.equipmentId}/history`)
      .send({ ...SHOP_RECORD, note: "" });
    const badKind = await world.shop.agent
      .post(`/api/machines/${world.equipmentId}/history`)
      .send({ ...SHOP_RECORD, kind: "miracle" });

    expect(future.status).toBe(422);
    expect(future.body.error.fields[0].path).toBe("body.performedOn");
    expect(noNote.status).toBe(422);
    expect(JSON.stringify(noNote.body)).toContain("body.note");
    expect(badKind.status).toBe(422);
    expect(JSON.stringify(badKind.body)).toContain("body.kind");
    const history = await world.shop.agent.get(`/api/machines/${world.equipmentId}/history`);
    expect(history.body.entries).toEqual([]);
  });

  it("exports the history as CSV with formula-looking cells defused (OWASP CSV Injection)", async () => {
    const world = await buildWorkOrderWorld(t.app);
    await confirmedOnMachine(world);
    await world.shop.agent
      .post(`/api/machines/${world.equipmentId}/history`)
      .send({ ...SHOP_RECORD, note: '=HYPERLINK("http://example.invalid")' })
      .expect(201);

    const res = await world.shop.agent.get(`/api/machines/${world.equipmentId}/history.csv`);

    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toContain("text/csv");
    expect(res.headers["content-disposition"]).toContain("attachment");
    const lines = res.text.split(/\r\n/);
    expect(lines[0]).toBe(
      "Date,Source,Work order,Kind of work,Problem area,Repeat fault,Service company,Technician,Hours on site,Travel hours,What was done,Parts used,Attachments,Standing at completion",
    );
    expect(res.text).toContain("Recorded by the shop");
    expect(res.text).toContain("Work order on Clearbench");
    expect(res.text).toContain("1 × Drawbar spring set (DS-40-7)");
    expect(res.text).toContain(`"'=HYPERLINK(""http://example.invalid"")"`);
    expect(res.text).not.toMatch(/,"?=HYPERLINK/);
  });

  it("serves a printable page that escapes what the shop wrote and loads nothing", async () => {
    const world = await buildWorkOrderWorld(t.app);
    await world.shop.agent
      .post(`/api/machines/${world.equipmentId}/history`)
      .send({ ...SHOP_RECORD, note: "<script>alert(1)</script> rebuilt" })
      .expect(201);

    const res = await world.shop.agent.get(`/api/machines/${world.equipmentId}/history/print`);

    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toContain("text/html");
    expect(res.headers["content-security-policy"]).toContain("default-src 'none'");
    expect(res.text).toContain("Service history: Corvane Machine Co. Corvane V-560");
    expect(res.text).toContain("&lt;script&gt;alert(1)&lt;/script&gt; rebuilt");
    expect(res.text).not.toContain("<script>");
    expect(res.text).toContain("Recorded by the shop");
  });
});

describe("who sees a machine and its history", () => {
  it("answers 404 to another shop's buyer and 403 to a service company, for the record, history and exports", async () => {
    const world = await buildWorkOrderWorld(t.app);
    await confirmedOnMachine(world);
    const otherShop = await signedInAgent(t.app, "shop", "buyer");
    const base = `/api/machines/${world.equipmentId}`;
    const reads = [base, `${base}/history`, `${base}/history.csv`, `${base}/history/print`];

    const foreign = await Promise.all(reads.map((p) => otherShop.agent.get(p)));
    const service = await Promise.all(reads.map((p) => world.provider.admin.get(p)));
    const tech = await Promise.all(reads.map((p) => world.provider.tech.get(p)));
    const write = await otherShop.agent.post(`${base}/history`).send(SHOP_RECORD);
    const serviceWrite = await world.provider.admin.post(`${base}/history`).send(SHOP_RECORD);

    expect(foreign.map((r) => r.status)).toEqual([404, 404, 404, 404]);
    expect(service.map((r) => r.status)).toEqual([403, 403, 403, 403]);
    expect(tech.map((r) => r.status)).toEqual([403, 403, 403, 403]);
    expect(write.status).toBe(404);
    expect(serviceWrite.status).toBe(403);
    for (const r of [...foreign, ...service, ...tech]) expect(r.text).not.toContain("Drawbar");
    const own = await world.shop.agent.get(`${base}/history`);
    expect(own.body.entries).toHaveLength(1);
  });

  it("answers 401 when not signed in", async () => {
    const world = await buildWorkOrderWorld(t.app);

    const res = await request(t.app)
      .get(`/api/machines/${world.equipmentId}/history`)
      .set(CSRF_HEADER, CSRF_HEADER_VALUE);

    expect(res.status).toBe(401);
  });
});
