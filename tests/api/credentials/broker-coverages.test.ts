import { describe, expect, it } from "vitest";
import request from "supertest";
import { useTestApp } from "../../support/test-app.ts";
import { buildProvider, signedInAgent } from "../../support/build-provider.ts";
import { submitLiabilityCertificate } from "../../support/submit-credential.ts";
import { useMailCatcher } from "../../support/mail-catcher.ts";
import { Credential } from "../../../server/credentials/model.ts";
import { BrokerUploadRequest } from "../../../server/credentials/broker-model.ts";
import { remindBrokers } from "../../../server/credentials/broker-reminders.ts";
import { db } from "../../../server/db/sequelize.ts";

const t = useTestApp();
const mail = useMailCatcher();

const DAY_MS = 24 * 3600 * 1000;
type Row = {
  typeCode: string;
  broker: { source: string; agency: string } | null;
  coverage: { credentialId: number } | null;
  requests: { id: number; linkState: string; origin: string; reminders: { daysBefore: number }[] }[];
};
const byType = (body: Row[], code: string) => body.find((r) => r.typeCode === code)!;

describe("the office's broker screen, per coverage", () => {
  it("records a coverage's own broker over the company's, and goes back to the company's when it is removed", async () => {
    const provider = await buildProvider(t.app);
    await provider.admin
      .put("/api/broker-contacts")
      .send({ agency: "Quarry Hill Agency", contactName: "Halvard Pence", email: "q@agency.example.test" })
      .expect(200);
    await provider.admin
      .put("/api/broker-contacts")
      .send({
        typeCode: "workers_comp",
        agency: "Tidewater Comp Brokers",
        contactName: "Imke Soller",
        email: "t@agency.example.test",
      })
      .expect(200);

    const screen = await provider.admin.get("/api/broker-coverages");
    const edited = await provider.admin.put("/api/broker-contacts").send({
      typeCode: "workers_comp",
      agency: "Tidewater Comp Brokers LLC",
      contactName: "Imke Soller",
      email: "t@agency.example.test",
    });
    const afterEdit = await provider.admin.get("/api/broker-coverages");
    const removed = await provider.admin.delete("/api/broker-contacts/workers_comp");
    const afterRemove = await provider.admin.get("/api/broker-coverages");
    const removedAgain = await provider.admin.delete("/api/broker-contacts/workers_comp");

    expect(screen.status).toBe(200);
    expect(byType(screen.body, "workers_comp").broker).toMatchObject({
      source: "coverage",
      agency: "Tidewater Comp Brokers",
    });
    expect(byType(screen.body, "general_liability").broker).toMatchObject({
      source: "company",
      agency: "Quarry Hill Agency",
    });
    expect(edited.status).toBe(200);
    expect(byType(afterEdit.body, "workers_comp").broker!.agency).toBe("Tidewater Comp Brokers LLC");
    expect(removed.status).toBe(204);
    expect(byType(afterRemove.body, "workers_comp").broker).toMatchObject({ source: "company" });
    expect(removedAgain.status).toBe(404);
  });

  it("shows each request's link state (sent, used, expired) and the reminders sent on it", async () => {
    const provider = await buildProvider(t.app);
    await provider.admin
      .put("/api/broker-contacts")
      .send({
        agency: "Quarry Hill Agency",
        contactName: "Halvard Pence",
        email: `b-${provider.company.id}@agency.example.test`,
      })
      .expect(200);
    const coverage = await submitLiabilityCertificate(provider.admin, 81);
    const expired = await provider.admin
      .post("/api/broker-requests")
      .send({ typeCode: "umbrella_liability" });
    await BrokerUploadRequest.update(
      { expiresAt: new Date(Date.now() - 1000) },
      { where: { id: expired.body.id } },
    );
    const sent = await provider.admin.post("/api/broker-requests").send({ credentialId: coverage.id });
    const lapsesAt = new Date(Date.now() + 20 * DAY_MS);
    await Credential.update({ lapsesAt }, { where: { id: coverage.id } });
    await remindBrokers(new Date(), "http://clearbench.test");
    await mail.deliver();

    const screen = await provider.admin.get("/api/broker-coverages");
    await BrokerUploadRequest.update({ usedAt: new Date() }, { where: { id: sent.body.id } });
    const afterUse = await provider.admin.get("/api/broker-coverages");

    const liability = byType(screen.body, "general_liability");
    expect(liability.coverage!.credentialId).toBe(coverage.id);
    expect(liability.requests).toEqual([
      expect.objectContaining({ id: sent.body.id, linkState: "sent", origin: "office" }),
    ]);
    // 20 days before the lapse crosses the 30-day threshold (common practice: 30, 14 and 7 days).
    expect(liability.requests[0]!.reminders).toEqual([expect.objectContaining({ daysBefore: 30 })]);
    expect(byType(screen.body, "umbrella_liability").requests[0]).toMatchObject({ linkState: "expired" });
    expect(byType(afterUse.body, "general_liability").requests[0]!.linkState).toBe("used");
  });

  it("holds nothing of another company, and is the office's only", async () => {
    const provider = await buildProvider(t.app);
    const other = await buildProvider(t.app);
    await other.admin
      .put("/api/broker-contacts")
      .send({
        agency: "Other Agency",
        contactName: "Someone Else",
        email: `o-${other.company.id}@agency.example.test`,
      })
      .expect(200);
    await other.admin.post("/api/broker-requests").send({ typeCode: "general_liability" }).expect(201);
    const shop = await signedInAgent(t.app, "shop", "buyer");

    const mine = await provider.admin.get("/api/broker-coverages");
    const removeTheirs = await provider.admin.delete("/api/broker-contacts/general_liability");
    const asShop = await shop.agent.get("/api/broker-coverages");
    const anonymous = await request(t.app).get("/api/broker-coverages");

    expect(mine.body.every((r: Row) => r.broker === null && r.requests.length === 0)).toBe(true);
    expect(JSON.stringify(mine.body)).not.toContain("Other Agency");
    expect(removeTheirs.status).toBe(404);
    expect(asShop.status).toBe(403);
    expect(anonymous.status).toBe(401);
    const [rows] = await db().query("SELECT id FROM broker_contacts WHERE company_id = :id", {
      replacements: { id: other.company.id },
    });
    expect(rows).toHaveLength(1);
  });
});
