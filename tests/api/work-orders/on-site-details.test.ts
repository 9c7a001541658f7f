import { describe, expect, it } from "vitest";
import { Op } from "sequelize";
import { useTestApp } from "../../support/test-app.ts";
import {
  acceptBody,
  buildWorkOrderWorld,
  raiseBody,
  type WorkOrderWorld,
} from "../../fixtures/build-work-order-world.ts";
import { OutboxMessage } from "../../../server/mail/model.ts";

const t = useTestApp();

const DETAILS = {
  siteContactName: "Marisol Okafor",
  siteContactPhone: "(312) 555-0142 x12",
  poNumber: "PO-88123-B",
  // $2,450.75 held as whole cents: money is never a float (common practice).
  notToExceedCents: 245_075,
  safetyInductionNote: "Report to Gate 3; 20-minute induction video before entering the machine hall.",
};
// Every value that must stay off the service side's answers until it accepts; the street address is the world's site.
const SECRETS = [
  "400 Foundry Row",
  DETAILS.siteContactName,
  DETAILS.siteContactPhone,
  DETAILS.poNumber,
  "245075",
  "2,450.75",
  "Gate 3",
];

const mailsTo = (address: string, id: number) =>
  OutboxMessage.findAll({
    where: { toAddress: address, subject: { [Op.like]: `Work order #${id}:%` } },
    order: [["id", "ASC"]],
  });

async function raised(world: WorkOrderWorld, overrides: Record<string, unknown> = DETAILS) {
  const res = await world.shop.agent.post("/api/work-orders").send(raiseBody(world, overrides));
  expect(res.status).toBe(201);
  return res.body.id as number;
}

describe("what the technician needs to show up", () => {
  it("keeps the address, contact, PO, not-to-exceed and induction note out of every service-side answer while requested", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await raised(world);

    const answers = await Promise.all([
      world.provider.admin.get(`/api/work-orders/${id}`),
      world.provider.tech.get(`/api/work-orders/${id}`),
      world.provider.tech.get("/api/work-orders"),
      world.provider.admin.get(`/api/work-orders/${id}/messages`),
      world.provider.admin.get(`/api/work-orders/${id}/standing-proof`),
    ]);
    const mails = [
      ...(await mailsTo(world.provider.adminUser.email, id)),
      ...(await mailsTo(world.provider.techUser.email, id)),
    ];

    for (const res of answers) {
      expect(res.status).toBe(200);
      const text = res.type === "application/json" ? JSON.stringify(res.body) : res.text;
      for (const secret of SECRETS) expect(text).not.toContain(secret);
    }
    expect(answers[0]!.body).not.toHaveProperty("onSite");
    expect(mails.length).toBeGreaterThan(0);
    for (const mail of mails)
      for (const secret of SECRETS) expect(`${mail.textBody}${mail.htmlBody}`).not.toContain(secret);
  });

  it("shows the shop what it entered, with the amount in whole cents", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await raised(world);

    const res = await world.shop.agent.get(`/api/work-orders/${id}`);

    expect(res.body.onSite).toMatchObject({
      addressLine: "400 Foundry Row",
      postalCode: "60601",
      ...DETAILS,
    });
  });

  it("sends them to the service side on accepting: in the answer, in both parts of the e-mail and on the printable proof", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await raised(world);

    const accepted = await world.provider.admin.post(`/api/work-orders/${id}/accept`).send(acceptBody());
    const techView = await world.provider.tech.get(`/api/work-orders/${id}`);
    const proof = await world.provider.tech.get(`/api/work-orders/${id}/standing-proof`);
    const sheet = (await mailsTo(world.provider.techUser.email, id)).find((m) =>
      m.subject.includes("what you need on site"),
    );

    expect(accepted.status).toBe(200);
    expect(techView.body.onSite).toMatchObject({ addressLine: "400 Foundry Row", ...DETAILS });
    expect(sheet).toBeDefined();
    for (const part of [sheet!.textBody, sheet!.htmlBody!]) {
      expect(part).toContain("400 Foundry Row");
      expect(part).toContain("Marisol Okafor");
      expect(part).toContain("(312) 555-0142 x12");
      expect(part).toContain("PO-88123-B");
      expect(part).toContain("$2,450.75");
      expect(part).toContain("Gate 3");
    }
    expect(proof.status).toBe(200);
    expect(proof.text).toContain("400 Foundry Row");
    expect(proof.text).toContain("PO-88123-B");
    expect(proof.text).toContain("$2,450.75");
    expect(proof.text).toContain("Marisol Okafor");
  });

  it("starts the contact, induction note, PO and cap from the site when the buyer leaves them out", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const saved = await world.shop.agent.put(`/api/sites/${world.siteId}`).send({
      name: "Bellwether Works, Plant 2",
      addressLine: "400 Foundry Row",
      postalCode: "60601",
      contactName: "Teodor Lindqvist",
      contactPhone: "815-555-0199",
      safetyInductionNote: "Steel-toe boots and glasses past the yellow line.",
      defaultPoNumber: "PO-SITE-9",
      defaultNotToExceedCents: 150_000,
    });
    expect(saved.status).toBe(200);
    expect(saved.body).toMatchObject({ defaultPoNumber: "PO-SITE-9", defaultNotToExceedCents: 150_000 });
    const id = await raised(world, { poNumber: "PO-7" });

    const res = await world.shop.agent.get(`/api/work-orders/${id}`);

    expect(res.body.onSite).toMatchObject({
      siteContactName: "Teodor Lindqvist",
      siteContactPhone: "815-555-0199",
      safetyInductionNote: "Steel-toe boots and glasses past the yellow line.",
      // The buyer's own PO wins over the site's; the cap left out comes from the site.
      poNumber: "PO-7",
      notToExceedCents: 150_000,
    });
  });

  it.each([
    ["notToExceedCents", 12.5, "body.notToExceedCents"],
    ["notToExceedCents", 0, "body.notToExceedCents"],
    ["siteContactPhone", "call me", "body.siteContactPhone"],
    ["poNumber", "PO\u0000-1", "body.poNumber"],
  ])("refuses %s = %j with 422 naming the field, and saves nothing", async (field, value, path) => {
    const world = await buildWorkOrderWorld(t.app);

    const res = await world.shop.agent.post("/api/work-orders").send(raiseBody(world, { [field]: value }));
    const list = await world.shop.agent.get("/api/work-orders");

    expect(res.status).toBe(422);
    expect(res.body.error.fields.map((f: { path: string }) => f.path)).toContain(path);
    expect(list.body).toEqual([]);
  });
});
