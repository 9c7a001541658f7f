import { randomBytes } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { buildTestApp, sequelize, type TestApp } from "../../support/test-app.ts";
import { buildProvider, signedInAgent } from "../../support/build-provider.ts";
import {
  buildWorkOrderWorld,
  raiseBody,
  workOrderAt,
  type WorkOrderWorld,
  acceptBody,
} from "../../fixtures/build-work-order-world.ts";
import { Technician } from "../../../server/technicians/model.ts";
import { Credential, Document } from "../../../server/credentials/model.ts";

let t: TestApp;
let world: WorkOrderWorld;
let neverCleared: Technician;
let inactive: Technician;
const CONTACT_FIELDS = ["email", "phone", "postalCode", "latitude", "longitude"];

/** The stored baseline the directory reads, as the daily job or a decision would have written it. */
async function storeBaseline(technicianId: number, standing: "cleared" | "not_cleared") {
  await sequelize().query(
    `INSERT INTO technician_standings (technician_id, requirement_set_id, standing, earliest_lapse, results, computed_at)
     VALUES ($1, NULL, $2, NULL, '[]'::jsonb, CURRENT_TIMESTAMP)
     ON CONFLICT (technician_id, (coalesce(requirement_set_id, 0))) DO UPDATE SET standing = EXCLUDED.standing`,
    { bind: [technicianId, standing], type: QueryTypes.INSERT },
  );
}

async function colleague(name: string) {
  const base = world.provider.technician;
  return Technician.create({
    companyId: base.companyId,
    name,
    email: `${name.split(" ")[0]!.toLowerCase()}@example.test`,
    phone: "555-0142",
    technologies: ["lathe"],
    controlFamilies: [],
    postalCode: "60601",
    latitude: 41.8858,
    longitude: -87.6181,
    serviceRadiusKm: 100,
    hourlyRateCents: 13000,
    travelRateCents: 9000,
  });
}

beforeAll(async () => {
  t = buildTestApp();
  world = await buildWorkOrderWorld(t.app);
  await world.provider.technician.update({ email: "rosalind@example.test", phone: "555-0199" });
  await storeBaseline(world.provider.technician.id, "cleared");
  neverCleared = await colleague("Oskar Feldhaven");
  inactive = await colleague("Imelda Quarrington");
  await storeBaseline(inactive.id, "cleared");
  await inactive.update({ active: false });
}, 60_000);
afterAll(() => t.close());

describe("what a shop sees of a technician", () => {
  it("answers a new shop 404 for an inactive or never-cleared technician, exactly as for a missing id", async () => {
    const shop = await signedInAgent(t.app, "shop", "buyer");

    const missing = await shop.agent.get("/api/technicians/99999999");
    const uncleared = await shop.agent.get(`/api/technicians/${neverCleared.id}`);
    const gone = await shop.agent.get(`/api/technicians/${inactive.id}`);
    const reviews = await shop.agent.get(`/api/technicians/${neverCleared.id}/reviews`);

    expect([missing.status, uncleared.status, gone.status, reviews.status]).toEqual([404, 404, 404, 404]);
    expect(uncleared.body).toEqual(missing.body);
    expect(gone.body).toEqual(missing.body);
  });

  it("shows a new shop the directory profile of a listed technician and no contact details", async () => {
    const shop = await signedInAgent(t.app, "shop", "buyer");

    const res = await shop.agent.get(`/api/technicians/${world.provider.technician.id}`);

    expect(res.status).toBe(200);
    expect(res.body.name).toBe(world.provider.technician.name);
    expect(res.body.hourlyRateCents).toBe(14000);
    for (const field of [...CONTACT_FIELDS, "active", "hasAccount"])
      expect(res.body).not.toHaveProperty(field);
  });

  it("gives the shop contact details only once the technician has accepted its work order", async () => {
    const path = `/api/technicians/${world.provider.technician.id}`;
    await workOrderAt(world, "requested");
    const whileRequested = await world.shop.agent.get(path);

    await workOrderAt(world, "accepted");
    const afterAcceptance = await world.shop.agent.get(path);
    const otherShop = await (await signedInAgent(t.app, "shop", "buyer")).agent.get(path);

    expect(whileRequested.body).not.toHaveProperty("email");
    expect(afterAcceptance.status).toBe(200);
    expect(afterAcceptance.body).toMatchObject({
      email: "rosalind@example.test",
      phone: "555-0199",
      postalCode: "60601",
    });
    expect(afterAcceptance.body).not.toHaveProperty("hasAccount");
    expect(otherShop.body).not.toHaveProperty("phone");
  });

  it("lists only listed technicians of a rostered company, on the roster and in its CSV", async () => {
    const shop = await signedInAgent(t.app, "shop", "buyer");
    await shop.agent.post("/api/roster").send({ serviceCompanyId: world.provider.company.id }).expect(201);

    const roster = await shop.agent.get("/api/roster");
    const csv = await shop.agent.get("/api/roster/export.csv");

    const names = roster.body.flatMap((e: { technicians: { name: string }[] }) =>
      e.technicians.map((m) => m.name),
    );
    expect(names).toEqual([world.provider.technician.name]);
    expect(csv.text).toContain(world.provider.technician.name);
    expect(csv.text).not.toContain(neverCleared.name);
    expect(csv.text).not.toContain(inactive.name);
  });

  it("refuses to roster a hidden technician by id, as if the id were unknown", async () => {
    const shop = await signedInAgent(t.app, "shop", "buyer");

    const res = await shop.agent.post("/api/roster").send({ technicianId: neverCleared.id });

    expect(res.status).toBe(404);
  });
});

describe("a hidden technician's credentials", () => {
  it("answers a shop 404 for a verified card of a technician it may not see, naming no one", async () => {
    const document = await Document.create({
      companyId: world.provider.company.id,
      uploadedBy: world.provider.adminUser.id,
      sha256: randomBytes(32).toString("hex"),
      sizeBytes: 1000,
      mime: "application/pdf",
      originalName: "osha-10-oskar.pdf",
      extractedText: null,
      extractionMethod: "none",
    });
    const card = await Credential.create({
      typeCode: "osha_10",
      companyId: world.provider.company.id,
      technicianId: neverCleared.id,
      documentId: document.id,
      state: "verified",
      fields: { holderName: neverCleared.name, issueDate: "2025-05-02", cardNumber: "OC-31337" },
      submittedBy: world.provider.adminUser.id,
      lapsesAt: null,
    });
    const shop = await signedInAgent(t.app, "shop", "buyer");

    const hidden = await shop.agent.get(`/api/credentials/${card.id}`);
    const missing = await shop.agent.get("/api/credentials/99999999");

    expect(hidden.status).toBe(404);
    expect(hidden.body).toEqual(missing.body);
  });
});

describe("a technician's reviews", () => {
  it("answers a rival company's technician and admin 404, and shows shops no shop, author or work order", async () => {
    const workOrderId = await workOrderAt(world, "confirmed");
    await world.shop.agent
      .post(`/api/work-orders/${workOrderId}/review`)
      .send({ stars: 4, body: "Reset the spindle orientation and checked runout." })
      .expect(201);
    const rival = await buildProvider(t.app);
    const stranger = await signedInAgent(t.app, "shop", "buyer");
    const path = `/api/technicians/${world.provider.technician.id}/reviews`;

    const byRivalTech = await rival.tech.get(path);
    const byRivalAdmin = await rival.admin.get(path);
    const byShop = await stranger.agent.get(path);
    const byOwnAdmin = await world.provider.admin.get(path);

    expect([byRivalTech.status, byRivalAdmin.status]).toEqual([404, 404]);
    expect(byShop.status).toBe(200);
    expect(byShop.body.count).toBeGreaterThanOrEqual(1);
    for (const item of byShop.body.items)
      expect(Object.keys(item).sort()).toEqual(["createdAt", "id", "reply", "stars", "text"]);
    expect(JSON.stringify(byShop.body)).not.toContain(world.shop.company.name);
    expect(JSON.stringify(byShop.body)).not.toContain(world.shop.user.name);
    expect(byOwnAdmin.status).toBe(200);
  });
});

describe("standing snapshots as the shop reads them", () => {
  it("leave out the card number in the shop's snapshot and printable proof, and keep it for the service company", async () => {
    const cardNumber = `OSHA-${randomBytes(4).toString("hex").toUpperCase()}`;
    const document = await Document.create({
      companyId: world.provider.company.id,
      uploadedBy: world.provider.techUser.id,
      sha256: randomBytes(32).toString("hex"),
      sizeBytes: 1000,
      mime: "application/pdf",
      originalName: "osha-10-card.pdf",
      extractedText: null,
      extractionMethod: "none",
    });
    await Credential.create({
      typeCode: "osha_10",
      companyId: world.provider.company.id,
      technicianId: world.provider.technician.id,
      documentId: document.id,
      state: "verified",
      fields: { holderName: world.provider.technician.name, issueDate: "2025-03-14", cardNumber },
      submittedBy: world.provider.techUser.id,
      lapsesAt: null,
    });
    const set = await world.shop.agent.post("/api/requirement-sets").send({
      name: "Floor work with forklifts nearby",
      siteId: world.siteId,
      requirements: [{ label: "OSHA 10-hour card", typeCodes: ["osha_10"] }],
    });
    expect(set.status).toBe(201);
    const raised = await world.shop.agent
      .post("/api/work-orders")
      .send(raiseBody(world, { requirementSetId: set.body.id }));
    expect(raised.status).toBe(201);
    await world.provider.admin
      .post(`/api/work-orders/${raised.body.id}/accept`)
      .send(acceptBody())
      .expect(200);
    const policyNumber = (world.generalLiability.fields as { policyNumber: string }).policyNumber;

    const shopView = await world.shop.agent.get(`/api/work-orders/${raised.body.id}`);
    const serviceView = await world.provider.admin.get(`/api/work-orders/${raised.body.id}`);
    const shopProof = await world.shop.agent.get(`/api/work-orders/${raised.body.id}/standing-proof`);
    const serviceProof = await world.provider.admin.get(`/api/work-orders/${raised.body.id}/standing-proof`);

    expect(JSON.stringify(serviceView.body.snapshotAccepted)).toContain(cardNumber);
    expect(JSON.stringify(shopView.body.snapshotAccepted)).not.toContain(cardNumber);
    expect(JSON.stringify(shopView.body.snapshotAccepted)).toContain(policyNumber);
    expect(serviceProof.text).toContain(cardNumber);
    expect(shopProof.status).toBe(200);
    expect(shopProof.text).not.toContain(cardNumber);
    expect(shopProof.text).toContain(policyNumber);
  });
});
