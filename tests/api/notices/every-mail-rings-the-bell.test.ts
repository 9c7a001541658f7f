import { describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import type request from "supertest";
import { useTestApp } from "../../support/test-app.ts";
import { signedInAgent } from "../../support/build-provider.ts";
import { submitLiabilityCertificate } from "../../support/submit-credential.ts";
import { acceptBody, buildWorkOrderWorld, raiseBody } from "../../fixtures/build-work-order-world.ts";
import { db } from "../../../server/db/sequelize.ts";

const t = useTestApp();

type Agent = ReturnType<typeof request.agent>;

async function bellTitles(agent: Agent): Promise<string[]> {
  const res = await agent.get("/api/notifications?limit=200");
  expect(res.status).toBe(200);
  return (res.body.notifications as { title: string }[]).map((n) => n.title);
}

/** Every queued e-mail to a signed-up person of these companies, with whether a bell notice carries the same subject. */
async function mailsWithoutBell(companyIds: number[]) {
  return db().query<{ to_address: string; subject: string }>(
    `SELECT m.to_address, m.subject
       FROM outbox_messages m JOIN users u ON u.email = m.to_address
      WHERE u.company_id = ANY($1::int[]) AND u.active
        AND NOT EXISTS (SELECT 1 FROM notifications n WHERE n.user_id = u.id AND n.title = m.subject)`,
    { bind: [companyIds], type: QueryTypes.SELECT },
  );
}

describe("every event that sends an e-mail also lands in the bell", () => {
  it("rings the office and the technician when a work order is raised, and the buyer when it is accepted and completed, and the office on confirmation", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const { shop, provider } = world;

    const raised = await shop.agent.post("/api/work-orders").send(raiseBody(world));
    const id = raised.body.id as number;
    const officeAfterRaise = await bellTitles(provider.admin);
    const techAfterRaise = await bellTitles(provider.tech);
    await provider.admin.post(`/api/work-orders/${id}/accept`).send(acceptBody());
    const buyerAfterAccept = await bellTitles(shop.agent);
    await provider.tech
      .post(`/api/work-orders/${id}/complete`)
      .send({ hoursWorked: 2, travelHours: 1, note: "Reseated the encoder cable." });
    const buyerAfterComplete = await bellTitles(shop.agent);
    await shop.agent.post(`/api/work-orders/${id}/confirm`).send({});
    const officeAfterConfirm = await bellTitles(provider.admin);

    expect(raised.status).toBe(201);
    expect(officeAfterRaise).toEqual([expect.stringMatching(new RegExp(`^Work order #${id}:`))]);
    expect(techAfterRaise).toEqual(officeAfterRaise);
    expect(buyerAfterAccept).toHaveLength(1);
    expect(buyerAfterComplete).toHaveLength(2);
    // Raised, accepted (what the office needs on site) and confirmed.
    expect(officeAfterConfirm).toHaveLength(3);
    // The bell and the mail say the same thing: no mail to a signed-up person of either side without its bell notice.
    expect(await mailsWithoutBell([shop.company.id, provider.company.id])).toEqual([]);
  });

  it("rings the buyer when a work order is declined, with the reason in the notice", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const raised = await world.shop.agent.post("/api/work-orders").send(raiseBody(world));

    await world.provider.tech
      .post(`/api/work-orders/${raised.body.id}/decline`)
      .send({ reason: "Booked through the end of the month" });
    const bell = await world.shop.agent.get("/api/notifications");

    expect(bell.body.unreadCount).toBe(1);
    expect(bell.body.notifications[0]).toMatchObject({ kind: "work_order" });
    expect(bell.body.notifications[0].body).toContain("Booked through the end of the month");
    expect(bell.body.notifications[0].link).toMatch(new RegExp(`/work-orders/${raised.body.id}$`));
  });

  it("rings the uploader when a reviewer returns a document and when the corrected one is verified", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");
    const first = await submitLiabilityCertificate(world.provider.admin, 71);
    const second = await submitLiabilityCertificate(world.provider.admin, 72);

    await reviewer
      .post(`/api/credentials/${first.id}/return`)
      .send({ reason: "The named insured differs from the company name." });
    const afterReturn = await world.provider.admin.get("/api/notifications");
    await reviewer.post(`/api/credentials/${second.id}/verify`).send({});
    const afterVerify = await world.provider.admin.get("/api/notifications");
    const technician = await bellTitles(world.provider.tech);

    expect(afterReturn.body.notifications[0]).toMatchObject({
      kind: "credential_returned",
      title: expect.stringMatching(/^Returned: /),
    });
    expect(afterReturn.body.notifications[0].body).toContain("does not count");
    expect(afterReturn.body.notifications[0].link).toContain("/documents/new?type=general_liability");
    expect(afterVerify.body.notifications[0]).toMatchObject({
      kind: "credential_verified",
      title: expect.stringMatching(/^Verified: /),
    });
    // Company insurance is the office's to renew: the technician's bell stays out of it.
    expect(technician).toEqual([]);
    expect(await mailsWithoutBell([world.provider.company.id])).toEqual([]);
  });
});
