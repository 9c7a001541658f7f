import { describe, expect, it } from "vitest";
import request from "supertest";
import { useTestApp } from "../../support/test-app.ts";
import { buildProvider, signedInAgent } from "../../support/build-provider.ts";
import { useMailCatcher } from "../../support/mail-catcher.ts";

const t = useTestApp();
const mail = useMailCatcher();

const input = {
  name: "Evander Quist",
  email: "evander@example.test",
  phone: "555-0142",
  technologies: ["lathe", "mill_turn"],
  controlFamilies: ["Kestle 40"],
  postalCode: "53202",
  serviceRadiusKm: 200,
  hourlyRateCents: 15_000,
  travelRateCents: 9_500,
};

describe("a provider manages its technicians", () => {
  it("adds a technician placed by ZIP code from the offline dataset", async () => {
    const { admin } = await buildProvider(t.app);

    const res = await admin.post("/api/technicians").send(input);
    const list = await admin.get("/api/technicians");

    expect(res.status).toBe(201);
    // zipcodes 8.0.0 data: 53202 is Milwaukee, WI at 43.0506, -87.8968.
    expect(res.body.latitude).toBeCloseTo(43.05, 1);
    expect(res.body.longitude).toBeCloseTo(-87.9, 1);
    expect(res.body.mileageRateCents).toBe(73);
    expect(list.body.map((x: { name: string }) => x.name)).toContain("Evander Quist");
  });

  it("refuses an unknown ZIP code and a negative rate, naming the fields", async () => {
    const { admin } = await buildProvider(t.app);

    const unknownZip = await admin.post("/api/technicians").send({ ...input, postalCode: "00000" });
    const negative = await admin.post("/api/technicians").send({ ...input, hourlyRateCents: -5 });

    expect(unknownZip.status).toBe(422);
    expect(unknownZip.body.error.fields[0].path).toBe("body.postalCode");
    expect(negative.status).toBe(422);
    expect(negative.body.error.fields[0].path).toBe("body.hourlyRateCents");
  });

  it("edits and deactivates its own technician, whose sign-in stops working", async () => {
    const provider = await buildProvider(t.app);

    const edited = await provider.admin
      .put(`/api/technicians/${provider.technician.id}`)
      .send({ ...input, name: "Rosalind Tennant-Okoye" });
    const off = await provider.admin.post(`/api/technicians/${provider.technician.id}/deactivate`);
    const techMe = await provider.tech.get("/api/auth/me");

    expect(edited.body.name).toBe("Rosalind Tennant-Okoye");
    expect(off.body.active).toBe(false);
    expect(techMe.status).toBe(401);
  });

  it("gives a technician a sign-in by an e-mailed link", async () => {
    const { admin } = await buildProvider(t.app);
    const added = await admin.post("/api/technicians").send({ ...input, email: undefined });

    const res = await admin
      .post(`/api/technicians/${added.body.id}/account`)
      .send({ email: `linked-${added.body.id}@example.test` });
    await mail.deliver();
    const again = await admin
      .post(`/api/technicians/${added.body.id}/account`)
      .send({ email: `other-${added.body.id}@example.test` });

    expect(res.status).toBe(201);
    expect(mail.to(`linked-${added.body.id}@example.test`)).toHaveLength(1);
    expect(again.status).toBe(409);
  });

  it("hides another company's technician exactly like a missing one", async () => {
    const mine = await buildProvider(t.app);
    const theirs = await buildProvider(t.app);

    const foreign = await mine.admin.put(`/api/technicians/${theirs.technician.id}`).send(input);
    const missing = await mine.admin.put(`/api/technicians/99999999`).send(input);

    expect(foreign.status).toBe(404);
    expect(foreign.body).toEqual(missing.body);
  });

  it("refuses the wrong roles and anonymous callers", async () => {
    const provider = await buildProvider(t.app);
    const { agent: buyer } = await signedInAgent(t.app, "shop", "buyer");

    const anonymous = await request(t.app).get("/api/technicians");
    const byTech = await provider.tech.post("/api/technicians").send(input);
    const byBuyer = await buyer.get("/api/technicians");

    expect(anonymous.status).toBe(401);
    expect(byTech.status).toBe(403);
    expect(byBuyer.status).toBe(403);
  });
});
