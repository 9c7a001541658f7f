import { describe, expect, it } from "vitest";
import { Op, QueryTypes } from "sequelize";
import { sequelize, useTestApp } from "../../support/test-app.ts";
import { buildProvider, signedInAgent } from "../../support/build-provider.ts";
import {
  acceptBody,
  buildWorkOrderWorld,
  insureProvider,
  workOrderAt,
} from "../../fixtures/build-work-order-world.ts";
import { OutboxMessage } from "../../../server/mail/model.ts";
import { AuditEvent } from "../../../server/audit/model.ts";
import { WorkOrder } from "../../../server/work-orders/model.ts";
import { addCalendarDays } from "../../../shared/standing/iso-date.ts";
import { calendarDateIn } from "../../../shared/dates/local-time.ts";
import { instantFromLocal } from "../../../shared/dates/zoned-instant.ts";

const t = useTestApp();

const REVIEW = { stars: 2, body: "The axis still drifted after the visit; we had to call again." };
const chicagoDay = (ahead: number) => addCalendarDays(calendarDateIn(new Date(), "America/Chicago"), ahead);

async function bellOf(userId: number) {
  return sequelize().query<{ kind: string; title: string; body: string }>(
    "SELECT kind, title, body FROM notifications WHERE user_id = $1 ORDER BY id",
    { bind: [userId], type: QueryTypes.SELECT },
  );
}

describe("the buyer cancels", () => {
  it.each(["requested", "accepted"] as const)(
    "cancels a %s work order with a reason: audited, e-mailed and put in the service side's bell",
    async (status) => {
      const world = await buildWorkOrderWorld(t.app);
      const id = await workOrderAt(world, status);

      const res = await world.shop.agent
        .post(`/api/work-orders/${id}/cancel`)
        .send({ reason: "The spindle came back after a power cycle" });
      const audit = await AuditEvent.findOne({
        where: { subjectType: "work_order", subjectId: id, action: "work_order.cancelled" },
      });
      const mails = await OutboxMessage.findAll({
        where: {
          toAddress: world.provider.techUser.email,
          subject: `Work order #${id}: cancelled by the shop`,
        },
      });
      const bell = await bellOf(world.provider.techUser.id);
      const adminBell = await bellOf(world.provider.adminUser.id);

      expect(res.status).toBe(200);
      expect(res.body).toMatchObject({
        status: "cancelled",
        cancelReason: "The spindle came back after a power cycle",
        actions: [],
      });
      expect(audit?.after).toMatchObject({ status: "cancelled" });
      expect(mails).toHaveLength(1);
      expect(mails[0]!.textBody).toContain("The spindle came back after a power cycle");
      expect(mails[0]!.htmlBody).toContain("The spindle came back after a power cycle");
      for (const b of [bell, adminBell])
        expect(b.filter((n) => n.kind === "work_order.cancelled")).toHaveLength(1);
    },
  );

  it("refuses a cancel without a reason (422) and a cancel of completed work (409), changing nothing", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const requested = await workOrderAt(world, "requested");
    const completed = await workOrderAt(world, "completed");

    const noReason = await world.shop.agent.post(`/api/work-orders/${requested}/cancel`).send({ reason: "" });
    const tooLate = await world.shop.agent
      .post(`/api/work-orders/${completed}/cancel`)
      .send({ reason: "Changed our minds" });
    const byService = await world.provider.admin
      .post(`/api/work-orders/${requested}/cancel`)
      .send({ reason: "We would rather not" });

    expect(noReason.status).toBe(422);
    expect(noReason.body.error.fields[0].path).toBe("body.reason");
    expect(tooLate.status).toBe(409);
    expect(byService.status).toBe(403);
    expect((await WorkOrder.findByPk(requested))!.status).toBe("requested");
    expect((await WorkOrder.findByPk(completed))!.status).toBe("completed");
  });
});

describe("confirm or dispute", () => {
  it("shows the shop the hours and the note before it decides", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "completed");

    const res = await world.shop.agent.get(`/api/work-orders/${id}`);

    expect(res.body).toMatchObject({ hoursWorked: 3.5, travelHours: 2, actions: ["confirm", "dispute"] });
  });

  it("posts the dispute reason to the thread and holds the rating until the shop confirms", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "completed");

    const disputed = await world.shop.agent
      .post(`/api/work-orders/${id}/dispute`)
      .send({ reason: "The Z axis still drifts 0.03 mm after warm-up" });
    const thread = await world.provider.tech.get(`/api/work-orders/${id}/messages`);
    const ratingWhileDisputed = await world.shop.agent.post(`/api/work-orders/${id}/review`).send(REVIEW);
    const reviewsWhileDisputed = await sequelize().query<{ n: number }>(
      "SELECT count(*)::int AS n FROM job_reviews WHERE work_order_id = $1",
      { bind: [id], type: QueryTypes.SELECT },
    );
    const bell = await bellOf(world.provider.adminUser.id);
    // Settled: the service side records the completion again, then the shop confirms and may rate.
    const again = await world.provider.tech
      .post(`/api/work-orders/${id}/complete`)
      .send({ hoursWorked: 1.5, travelHours: 2, note: "Re-shimmed the Z gib." });
    const confirmed = await world.shop.agent.post(`/api/work-orders/${id}/confirm`).send({});
    const rated = await world.shop.agent.post(`/api/work-orders/${id}/review`).send(REVIEW);

    expect(disputed.status).toBe(200);
    expect(disputed.body).toMatchObject({
      status: "disputed",
      disputeReason: "The Z axis still drifts 0.03 mm after warm-up",
      actions: ["confirm"],
    });
    expect(thread.body.map((m: { body: string }) => m.body)).toContain(
      "Disputed the completion: The Z axis still drifts 0.03 mm after warm-up",
    );
    expect(ratingWhileDisputed.status).toBe(403);
    expect(reviewsWhileDisputed[0]!.n).toBe(0);
    expect(bell.map((n) => n.kind)).toContain("work_order.disputed");
    expect(again.body).toMatchObject({ status: "completed", hoursWorked: 1.5 });
    expect(confirmed.body.status).toBe("confirmed");
    expect(rated.status).toBe(201);
  });

  it("refuses to dispute twice or before completion (409)", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const disputed = await workOrderAt(world, "disputed");
    const accepted = await workOrderAt(world, "accepted");

    const twice = await world.shop.agent
      .post(`/api/work-orders/${disputed}/dispute`)
      .send({ reason: "Still not right at all" });
    const early = await world.shop.agent
      .post(`/api/work-orders/${accepted}/dispute`)
      .send({ reason: "Not even started yet" });

    expect(twice.status).toBe(409);
    expect(early.status).toBe(409);
  });
});

describe("accept with an arrival time", () => {
  it("reads the arrival in the site's zone and stores the instant", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "requested");
    const local = `${chicagoDay(2)}T07:15`;

    const res = await world.provider.tech.post(`/api/work-orders/${id}/accept`).send({ arrivalLocal: local });
    const shopMail = await OutboxMessage.findOne({
      where: { toAddress: world.shop.user.email, subject: `Work order #${id}: accepted` },
    });

    expect(res.status).toBe(200);
    // The site is in Chicago: the instant is that wall time there (IANA tz database America/Chicago).
    expect(res.body.arrivalAt).toBe(instantFromLocal(local, "America/Chicago")!.toISOString());
    expect(shopMail!.textBody).toMatch(/7:15 AM C[SD]T/);
  });

  it.each([
    ["a missing time", {}],
    ["a time already past", { arrivalLocal: `${chicagoDay(-1)}T07:15` }],
    ["not a date-time", { arrivalLocal: "next Tuesday" }],
  ])("refuses %s with 422 on body.arrivalLocal and leaves it requested", async (_label, body) => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "requested");

    const res = await world.provider.admin.post(`/api/work-orders/${id}/accept`).send(body);

    expect(res.status).toBe(422);
    expect(res.body.error.fields[0].path).toBe("body.arrivalLocal");
    expect((await WorkOrder.findByPk(id))!.status).toBe("requested");
  });
});

describe("after a decline", () => {
  it("lets the buyer take the proposed date: the copy goes to the same technician on that date", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "requested", { poNumber: "PO-4410", notToExceedCents: 90_000 });
    const proposed = chicagoDay(6);

    const declined = await world.provider.admin
      .post(`/api/work-orders/${id}/decline`)
      .send({ reason: "Booked solid until next week", proposedDate: proposed });
    const shopView = await world.shop.agent.get(`/api/work-orders/${id}`);
    const copy = await world.shop.agent
      .post(`/api/work-orders/${id}/send-again`)
      .send({ technicianId: world.provider.technician.id, preferredDates: [proposed] });
    const original = await world.shop.agent.get(`/api/work-orders/${id}`);

    expect(declined.body).toMatchObject({ status: "declined", proposedDate: proposed });
    expect(shopView.body).toMatchObject({ proposedDate: proposed, canSendAgain: true });
    expect(copy.status).toBe(201);
    expect(copy.body).toMatchObject({
      status: "requested",
      preferredDates: [proposed],
      copiedFromId: id,
      technician: { id: world.provider.technician.id },
      onSite: { poNumber: "PO-4410", notToExceedCents: 90_000 },
    });
    expect(copy.body.id).not.toBe(id);
    expect(original.body).toMatchObject({ status: "declined", copies: [copy.body.id] });
  });

  it("copies the job to another technician the shop may see, and refuses one the shared rule hides", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "declined");
    const other = await buildProvider(t.app);
    await insureProvider(other);
    const uninsured = await buildProvider(t.app);

    const sent = await world.shop.agent
      .post(`/api/work-orders/${id}/send-again`)
      .send({ technicianId: other.technician.id });
    const hidden = await world.shop.agent
      .post(`/api/work-orders/${id}/send-again`)
      .send({ technicianId: uninsured.technician.id });
    const seenByOther = await other.admin.get(`/api/work-orders/${sent.body.id}`);
    const firstSideView = await world.provider.admin.get(`/api/work-orders/${id}`);

    expect(sent.status).toBe(201);
    expect(sent.body).toMatchObject({ technician: { id: other.technician.id }, status: "requested" });
    expect(seenByOther.status).toBe(200);
    expect(hidden.status).toBe(422);
    expect(hidden.body.error.fields[0].path).toBe("body.technicianId");
    // The first service company does not learn where the job went.
    expect(firstSideView.body.copies).toEqual([]);
    expect(await WorkOrder.count({ where: { copiedFromId: id } })).toBe(1);
  });

  it("refuses to send on a job that was not declined (409), by the service side (403) and by outsiders (404)", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const requested = await workOrderAt(world, "requested");
    const declined = await workOrderAt(world, "declined");
    const otherShop = await signedInAgent(t.app, "shop", "buyer");
    const body = { technicianId: world.provider.technician.id };

    const notDeclined = await world.shop.agent.post(`/api/work-orders/${requested}/send-again`).send(body);
    const byService = await world.provider.admin.post(`/api/work-orders/${declined}/send-again`).send(body);
    const byOutsider = await otherShop.agent.post(`/api/work-orders/${declined}/send-again`).send(body);

    expect(notDeclined.status).toBe(409);
    expect(byService.status).toBe(403);
    expect(byOutsider.status).toBe(404);
    expect(await WorkOrder.count({ where: { copiedFromId: { [Op.in]: [requested, declined] } } })).toBe(0);
  });

  it("refuses a proposed date already past (422)", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "requested");

    const res = await world.provider.admin
      .post(`/api/work-orders/${id}/decline`)
      .send({ reason: "Booked solid", proposedDate: chicagoDay(-3) });

    expect(res.status).toBe(422);
    expect(res.body.error.fields[0].path).toBe("body.proposedDate");
  });
});

describe("only the parties act", () => {
  it("answers 404 to another shop and another service company for every new decision", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const requested = await workOrderAt(world, "requested");
    const completed = await workOrderAt(world, "completed");
    const otherShop = await signedInAgent(t.app, "shop", "buyer");
    const otherProvider = await buildProvider(t.app);

    const responses = await Promise.all([
      otherShop.agent.post(`/api/work-orders/${requested}/cancel`).send({ reason: "Not our job at all" }),
      otherShop.agent.post(`/api/work-orders/${completed}/dispute`).send({ reason: "Not our job at all" }),
      otherProvider.admin.post(`/api/work-orders/${requested}/accept`).send(acceptBody()),
      otherProvider.tech.post(`/api/work-orders/${requested}/decline`).send({ reason: "Not our job at all" }),
    ]);

    expect(responses.map((r) => r.status)).toEqual([404, 404, 404, 404]);
  });
});
