import { describe, expect, it } from "vitest";
import { sequelize, useTestApp } from "../support/test-app.ts";
import { useMailCatcher } from "../support/mail-catcher.ts";
import { signedInAgent } from "../support/build-provider.ts";
import {
  buildClearedCompany,
  buildShop,
  estimateBody,
  onlyInvite,
  raiseRequest,
} from "../fixtures/build-service-request-world.ts";
import { addBusinessHours } from "../../shared/service-requests/business-hours.ts";
import { runServiceRequestFollowUp } from "../../jobs/service-request-follow-up.ts";
import { deliverAll, rows, runJobCli, HOUR } from "./job-support.ts";

const t = useTestApp();
const catcher = useMailCatcher();

const DEPS = {
  SERVICE_REQUEST_REMINDER_HOURS: 3,
  SERVICE_REQUEST_DOWN_REMINDER_HOURS: 1,
  SERVICE_REQUEST_EXPIRY_HOURS: 72,
  publicUrl: "https://clearbench.test",
};

/**
 * A request sent `hoursAgo` clock hours before now. 71 hours always hold at least 8 business hours (the longest gap,
 * Friday 5 p.m. to Monday 8 a.m., is 63 hours), and stay under the 72-hour expiry; requests other tests raise now are
 * younger than any threshold.
 */
async function requestSent(hoursAgo: number, machineState: "down" | "planned" = "planned") {
  const shop = await buildShop(t.app);
  const company = await buildClearedCompany(t.app);
  const request = await raiseRequest(shop, {
    machineState,
    ...(await onlyInvite(shop, [company.company.id])),
  });
  const sentAt = new Date(Date.now() - hoursAgo * HOUR);
  await sequelize().query("UPDATE service_requests SET sent_at = $2 WHERE id = $1", {
    bind: [request.id, sentAt],
  });
  await sequelize().query("UPDATE service_request_invitations SET invited_at = $2 WHERE request_id = $1", {
    bind: [request.id, sentAt],
  });
  return { shop, company, request, sentAt };
}

const reminders = (email: string, requestId: number) =>
  catcher.to(email).filter((m) => m.subject.startsWith(`Reminder: service request #${requestId} `));

const runJobProcess = (asOf: Date) =>
  runJobCli(["follow-up", "--as-of", asOf.toISOString()], {
    DATABASE_URL: t.config.DATABASE_URL,
    SMTP_URL: catcher.url,
  });

describe("service-request follow-up job", () => {
  it("reminds an invited company once after 3 business hours without an estimate, however often it runs", async () => {
    const { company, request } = await requestSent(71);

    await runServiceRequestFollowUp({ asOf: new Date() }, DEPS);
    await runServiceRequestFollowUp({ asOf: new Date() }, DEPS);
    await deliverAll(catcher);

    expect(reminders(company.adminUser.email, request.id)).toHaveLength(1);
    const events = await rows<{ kind: string; threshold_hours: string }>(
      "SELECT kind, threshold_hours FROM service_request_events WHERE request_id = $1 AND kind = 'reminder_sent'",
      [request.id],
    );
    expect(events).toEqual([{ kind: "reminder_sent", threshold_hours: "3.00" }]);
  });

  it("chases a machine-down request after 1 business hour while planned work waits for 3", async () => {
    const down = await requestSent(71, "down");
    const planned = await requestSent(71, "planned");
    const asOf = new Date(addBusinessHours(down.sentAt, 2, "America/Chicago").getTime());

    const report = await runServiceRequestFollowUp({ asOf }, DEPS);
    await deliverAll(catcher);

    expect(report.reminded).toBeGreaterThanOrEqual(1);
    expect(reminders(down.company.adminUser.email, down.request.id)).toHaveLength(1);
    expect(reminders(planned.company.adminUser.email, planned.request.id)).toHaveLength(0);
  });

  it("does not remind when an estimate has arrived, nor before the threshold", async () => {
    const answered = await requestSent(71);
    await answered.company.admin
      .post(`/api/service-requests/${answered.request.id}/estimates`)
      .send(estimateBody(answered.company))
      .expect(201);
    const fresh = await requestSent(0);

    await runServiceRequestFollowUp({ asOf: new Date() }, DEPS);
    await deliverAll(catcher);

    expect(reminders(answered.company.adminUser.email, answered.request.id)).toHaveLength(0);
    expect(reminders(fresh.company.adminUser.email, fresh.request.id)).toHaveLength(0);
  });

  it("lists the reminded request for coordinators, who log what they did on its timeline", async () => {
    const { shop, request } = await requestSent(71);
    const coordinator = await signedInAgent(t.app, "platform", "admin");
    await runServiceRequestFollowUp({ asOf: new Date() }, DEPS);

    const list = await coordinator.agent.get("/api/service-requests/follow-up");
    const logged = await coordinator.agent
      .post(`/api/service-requests/${request.id}/follow-up`)
      .send({ note: "Called the company; technician free tomorrow" });
    const shopView = await shop.agent.get(`/api/service-requests/${request.id}`);
    const buyerList = await shop.agent.get("/api/service-requests/follow-up");

    expect(list.body.map((r: { requestId: number }) => r.requestId)).toContain(request.id);
    expect(logged.status).toBe(200);
    expect(shopView.body.timeline.map((e: { kind: string }) => e.kind)).toEqual([
      "sent",
      "reminder_sent",
      "follow_up",
    ]);
    expect(buyerList.status).toBe(403);
  });

  it("expires a request left undecided past 72 hours and tells everyone invited and the shop", async () => {
    const { shop, company, request } = await requestSent(73);

    await runServiceRequestFollowUp({ asOf: new Date() }, DEPS);
    await deliverAll(catcher);
    const view = await shop.agent.get(`/api/service-requests/${request.id}`);

    expect(view.body.status).toBe("expired");
    expect(
      catcher.to(company.adminUser.email).some((m) => m.subject === `Service request #${request.id} expired`),
    ).toBe(true);
    expect(
      catcher.to(shop.user.email).some((m) => m.subject === `Service request #${request.id} expired`),
    ).toBe(true);
  });

  it("sends each reminder once when two processes run the job at the same time", async () => {
    const { company, request } = await requestSent(71);
    const asOf = new Date();

    const [a, b] = await Promise.all([runJobProcess(asOf), runJobProcess(asOf)]);
    await deliverAll(catcher);

    expect([a.code, b.code]).toEqual([0, 0]);
    expect(a.out + b.out).toMatch(/service-request follow-up as of/);
    expect(reminders(company.adminUser.email, request.id)).toHaveLength(1);
  }, 60_000);
});
