import { describe, expect, it } from "vitest";
import { Op } from "sequelize";
import { useTestApp } from "../../support/test-app.ts";
import { buildWorkOrderWorld, raiseBody, acceptBody } from "../../fixtures/build-work-order-world.ts";
import { OutboxMessage } from "../../../server/mail/model.ts";
import { AuditEvent } from "../../../server/audit/model.ts";
import { Technician } from "../../../server/technicians/model.ts";
import { policyEndInstant } from "../../../shared/standing/policy-period.ts";

const t = useTestApp();

const mailsFor = (address: string, workOrderId: number) =>
  OutboxMessage.findAll({
    where: { toAddress: address, subject: { [Op.like]: `Work order #${workOrderId}:%` } },
    order: [["id", "ASC"]],
  });

describe("a work order from request to confirmation", () => {
  it("moves requested → accepted → completed → confirmed, with a standing snapshot at accept and at completion and an e-mail to the other side each time", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const { shop, provider } = world;
    const glFields = world.generalLiability.fields as { policyNumber: string; expirationDate: string };

    const raised = await shop.agent.post("/api/work-orders").send(raiseBody(world));
    const id = raised.body.id as number;
    const beforeAccept = Date.now();
    const accepted = await provider.admin.post(`/api/work-orders/${id}/accept`).send(acceptBody());
    const completed = await provider.tech
      .post(`/api/work-orders/${id}/complete`)
      .send({ hoursWorked: 3.5, travelHours: 2, note: "Replaced the drawbar spring." });
    const confirmed = await shop.agent.post(`/api/work-orders/${id}/confirm`).send({});
    const seen = await shop.agent.get(`/api/work-orders/${id}`);

    expect(raised.status).toBe(201);
    expect(raised.body).toMatchObject({
      status: "requested",
      yourSide: "shop",
      technology: "mill",
      urgency: "down",
      actions: ["cancel"],
    });
    expect(raised.body.equipment).toMatchObject({
      builder: "Corvane Machine Co.",
      controlFamily: "Kestle 40",
    });
    expect(accepted.status).toBe(200);
    expect(accepted.body.status).toBe("accepted");
    expect(completed.status).toBe(200);
    expect(completed.body).toMatchObject({
      status: "completed",
      hoursWorked: 3.5,
      travelHours: 2,
      completionNote: "Replaced the drawbar spring.",
    });
    expect(confirmed.status).toBe(200);
    expect(seen.body.status).toBe("confirmed");
    expect(seen.body.confirmedAt).not.toBeNull();
    for (const snapshot of [seen.body.snapshotAccepted, seen.body.snapshotCompleted]) {
      expect(snapshot.standing).toBe("cleared");
      expect(Date.parse(snapshot.takenAt)).toBeGreaterThanOrEqual(beforeAccept - 1000);
      const general = snapshot.targets[0].requirements.find(
        (r: { label: string }) => r.label === "General liability in force",
      );
      expect(general.status).toBe("met");
      expect(general.credential).toMatchObject({
        id: world.generalLiability.id,
        typeCode: "general_liability",
        reference: glFields.policyNumber,
      });
      // The policy ends at 12:01 a.m. standard time on its expiration date at the insured's address (ISO CG DS 01 wording, from memory).
      expect(general.credential.lapsesAt).toBe(
        policyEndInstant(glFields.expirationDate, "America/Chicago").toISOString(),
      );
    }
    // raised, the job sheet once accepted, confirmed
    expect(await mailsFor(provider.adminUser.email, id)).toHaveLength(3);
    expect(await mailsFor(provider.techUser.email, id)).toHaveLength(3);
    expect(await mailsFor(shop.user.email, id)).toHaveLength(2); // accepted, completed
    const actions = (
      await AuditEvent.findAll({
        where: { subjectType: "work_order", subjectId: id },
        order: [["id", "ASC"]],
      })
    ).map((e) => e.action);
    expect(actions).toEqual([
      "work_order.raised",
      "work_order.accepted",
      "work_order.completed",
      "work_order.confirmed",
    ]);
  });

  it("records the decline with its reason and tells the buyer", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const raised = await world.shop.agent.post("/api/work-orders").send(raiseBody(world));

    const declined = await world.provider.tech
      .post(`/api/work-orders/${raised.body.id}/decline`)
      .send({ reason: "Booked solid until next month" });

    expect(declined.status).toBe(200);
    expect(declined.body).toMatchObject({
      status: "declined",
      declineReason: "Booked solid until next month",
    });
    expect(declined.body.declinedAt).not.toBeNull();
    const mails = await mailsFor(world.shop.user.email, raised.body.id);
    expect(mails.map((m) => m.textBody).join()).toContain("Booked solid until next month");
  });

  it("prints the proof of standing as an HTML page with every value escaped", async () => {
    const world = await buildWorkOrderWorld(t.app);
    await Technician.update(
      { name: `<img src=x onerror=alert(1)> Tennant` },
      { where: { id: world.provider.technician.id } },
    );
    const raised = await world.shop.agent.post("/api/work-orders").send(raiseBody(world));
    await world.provider.admin.post(`/api/work-orders/${raised.body.id}/accept`).send(acceptBody());

    const page = await world.shop.agent.get(`/api/work-orders/${raised.body.id}/standing-proof`);

    expect(page.status).toBe(200);
    expect(page.headers["content-type"]).toMatch(/^text\/html/);
    expect(page.headers["content-security-policy"]).toContain("default-src 'none'");
    expect(page.text).toContain((world.generalLiability.fields as { policyNumber: string }).policyNumber);
    expect(page.text).toContain("&lt;img src=x onerror=alert(1)&gt; Tennant");
    expect(page.text).not.toContain("<img");
  });
});

describe("lists of work orders", () => {
  it("shows each side its own work orders, filtered by status", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const other = await buildWorkOrderWorld(t.app);
    const first = await world.shop.agent.post("/api/work-orders").send(raiseBody(world));
    const second = await world.shop.agent.post("/api/work-orders").send(raiseBody(world));
    await world.provider.admin.post(`/api/work-orders/${second.body.id}/accept`).send(acceptBody());
    await other.shop.agent.post("/api/work-orders").send(raiseBody(other));

    const shopAll = await world.shop.agent.get("/api/work-orders");
    const shopRequested = await world.shop.agent.get("/api/work-orders?status=requested");
    const providerAccepted = await world.provider.admin.get("/api/work-orders?status=accepted");
    const techAll = await world.provider.tech.get("/api/work-orders");

    expect(shopAll.body.map((w: { id: number }) => w.id)).toEqual([second.body.id, first.body.id]);
    expect(shopRequested.body.map((w: { id: number }) => w.id)).toEqual([first.body.id]);
    expect(providerAccepted.body.map((w: { id: number }) => w.id)).toEqual([second.body.id]);
    expect(techAll.body).toHaveLength(2);
    expect(shopAll.body[0]).toMatchObject({
      siteName: "Bellwether Works, Plant 2",
      technicianName: world.provider.technician.name,
    });
  });

  it("answers 400 naming the parameter for an unknown status", async () => {
    const world = await buildWorkOrderWorld(t.app);

    const res = await world.shop.agent.get("/api/work-orders?status=finished");

    expect(res.status).toBe(400);
    expect(res.body.error.fields[0].path).toBe("query.status");
  });
});
