import { describe, expect, it } from "vitest";
import request from "supertest";
import { signedInAs, useTestApp } from "../../support/test-app.ts";
import { buildCompany } from "../../support/build-company.ts";
import type { CompanyKind, Role } from "../../../shared/accounts/schemas.ts";

const t = useTestApp();

async function signedIn(kind: CompanyKind, role: Role) {
  const { users, company } = await buildCompany(kind, [role]);
  const agent = await signedInAs(t.app, users[role]!.email);
  return { agent, company };
}

const plant = { name: "North Plant", addressLine: "400 Lathe Street", postalCode: "60601" };
const mill = {
  builder: "Aldenmark",
  controlFamily: "K7",
  technology: "mill",
  model: "VX-500",
  serialNumber: "AM-1001",
};

describe("shop sites", () => {
  it("places a new site at its ZIP code and suggests the ZIP's time zone", async () => {
    const { agent } = await signedIn("shop", "buyer");

    const res = await agent.post("/api/sites").send(plant);

    expect(res.status).toBe(201);
    // zipcodes 8.0.0 lookup("60601"): Chicago, IL, 41.8858, -87.6181
    expect(res.body).toMatchObject({
      name: "North Plant",
      postalCode: "60601",
      city: "Chicago",
      state: "IL",
      latitude: 41.8858,
      longitude: -87.6181,
    });
    expect(res.body.timeZone).toBe("America/Chicago");
  });

  it("keeps a time zone the buyer chose over the suggested one", async () => {
    const { agent } = await signedIn("shop", "buyer");

    const res = await agent.post("/api/sites").send({ ...plant, timeZone: "America/New_York" });

    expect(res.status).toBe(201);
    expect(res.body.timeZone).toBe("America/New_York");
  });

  it("refuses an unknown ZIP code with 422 naming body.postalCode", async () => {
    const { agent } = await signedIn("shop", "buyer");

    const res = await agent.post("/api/sites").send({ ...plant, postalCode: "00000" });

    expect(res.status).toBe(422);
    expect(res.body.error.message).toBe("Unknown ZIP code");
    expect(res.body.error.fields).toEqual([expect.objectContaining({ path: "body.postalCode" })]);
  });

  it("refuses a malformed site with 422 naming the field", async () => {
    const { agent } = await signedIn("shop", "buyer");

    const res = await agent.post("/api/sites").send({ ...plant, name: "" });

    expect(res.status).toBe(422);
    expect(res.body.error.fields[0].path).toBe("body.name");
  });

  it("lists, edits and archives the shop's own sites", async () => {
    const { agent } = await signedIn("shop", "buyer");
    const created = (await agent.post("/api/sites").send(plant).expect(201)).body;

    const edited = await agent
      .put(`/api/sites/${created.id}`)
      .send({ ...plant, name: "North Plant 2", postalCode: "53202" });
    const listed = await agent.get("/api/sites");
    const archived = await agent.delete(`/api/sites/${created.id}`);
    const afterArchive = await agent.get("/api/sites");
    const withArchived = await agent.get("/api/sites?includeArchived=true");

    expect(edited.status).toBe(200);
    expect(edited.body).toMatchObject({ name: "North Plant 2", city: "Milwaukee" });
    expect(listed.body.map((s: { id: number }) => s.id)).toEqual([created.id]);
    expect(archived.status).toBe(204);
    expect(afterArchive.body).toEqual([]);
    expect(withArchived.body[0]).toMatchObject({ id: created.id, active: false });
  });

  it("answers 401 when signed out", async () => {
    const res = await request(t.app).get("/api/sites");

    expect(res.status).toBe(401);
  });

  it.each([
    ["service", "provider_admin"],
    ["platform", "reviewer"],
  ] as const)("answers 403 to a %s %s", async (kind, role) => {
    const { agent } = await signedIn(kind, role);

    const res = await agent.get("/api/sites");

    expect(res.status).toBe(403);
  });

  it("answers 404 for another shop's site, as for a missing one", async () => {
    const owner = await signedIn("shop", "buyer");
    const other = await signedIn("shop", "buyer");
    const site = (await owner.agent.post("/api/sites").send(plant).expect(201)).body;

    const read = await other.agent.get(`/api/sites/${site.id}`);
    const edit = await other.agent.put(`/api/sites/${site.id}`).send(plant);
    const machines = await other.agent.get(`/api/sites/${site.id}/equipment`);
    const archive = await other.agent.delete(`/api/sites/${site.id}`);

    expect([read.status, edit.status, machines.status, archive.status]).toEqual([404, 404, 404, 404]);
    expect((await owner.agent.get(`/api/sites/${site.id}`)).body.active).toBe(true);
  });
});

describe("site equipment", () => {
  it("adds, lists, edits and removes a machine at the site", async () => {
    const { agent } = await signedIn("shop", "buyer");
    const site = (await agent.post("/api/sites").send(plant).expect(201)).body;

    const added = await agent.post(`/api/sites/${site.id}/equipment`).send(mill);
    const edited = await agent
      .put(`/api/sites/${site.id}/equipment/${added.body.id}`)
      .send({ ...mill, model: "VX-700" });
    const listed = await agent.get(`/api/sites/${site.id}/equipment`);
    const removed = await agent.delete(`/api/sites/${site.id}/equipment/${added.body.id}`);
    const afterRemoval = await agent.get(`/api/sites/${site.id}/equipment`);

    expect(added.status).toBe(201);
    expect(added.body).toMatchObject({
      siteId: site.id,
      builder: "Aldenmark",
      controlFamily: "K7",
      technology: "mill",
    });
    expect(edited.body.model).toBe("VX-700");
    expect(listed.body).toHaveLength(1);
    expect(removed.status).toBe(204);
    expect(afterRemoval.body).toEqual([]);
  });

  it("refuses a technology outside the list with 422 naming body.technology", async () => {
    const { agent } = await signedIn("shop", "buyer");
    const site = (await agent.post("/api/sites").send(plant).expect(201)).body;

    const res = await agent.post(`/api/sites/${site.id}/equipment`).send({ ...mill, technology: "loom" });

    expect(res.status).toBe(422);
    expect(res.body.error.fields[0].path).toBe("body.technology");
  });

  it("answers 404 for a machine reached through another shop's site", async () => {
    const owner = await signedIn("shop", "buyer");
    const other = await signedIn("shop", "buyer");
    const site = (await owner.agent.post("/api/sites").send(plant).expect(201)).body;
    const otherSite = (await other.agent.post("/api/sites").send(plant).expect(201)).body;
    const machine = (await owner.agent.post(`/api/sites/${site.id}/equipment`).send(mill).expect(201)).body;

    const direct = await other.agent.put(`/api/sites/${site.id}/equipment/${machine.id}`).send(mill);
    const viaOwnSite = await other.agent.delete(`/api/sites/${otherSite.id}/equipment/${machine.id}`);

    expect(direct.status).toBe(404);
    expect(viaOwnSite.status).toBe(404);
  });
});

describe("postal-code lookup", () => {
  it("gives the place and the suggested time zone of a ZIP code, offline", async () => {
    const { agent } = await signedIn("shop", "buyer");

    const res = await agent.get("/api/postal-codes/59101");

    expect(res.status).toBe(200);
    // zipcodes 8.0.0 and zipcode-to-timezone 0.0.9 data
    expect(res.body).toEqual({
      postalCode: "59101",
      city: "Billings",
      state: "MT",
      latitude: 45.7745,
      longitude: -108.5005,
      timeZone: "America/Denver",
    });
  });

  it("answers 404 Unknown ZIP code for a well-formed code that does not exist", async () => {
    const { agent } = await signedIn("shop", "buyer");

    const res = await agent.get("/api/postal-codes/00000");

    expect(res.status).toBe(404);
    expect(res.body.error.message).toBe("Unknown ZIP code");
  });

  it("answers 401 when signed out", async () => {
    const res = await request(t.app).get("/api/postal-codes/60601");

    expect(res.status).toBe(401);
  });
});
