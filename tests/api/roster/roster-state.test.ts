import { describe, expect, it } from "vitest";
import { agentFor, useTestApp, signedInAs } from "../../support/test-app.ts";
import { buildCompany } from "../../support/build-company.ts";
import { useDirectoryWorld } from "../../support/directory-suite.ts";

const t = useTestApp();
const { world, buyer } = useDirectoryWorld(t, { seed: 11, count: 10, companies: 3 });

const listed = () =>
  world.technicians.filter((x) => x.active && (x.baseline === "cleared" || x.baseline === "lapsing"));

async function otherShopBuyer() {
  const { users } = await buildCompany("shop", ["buyer"]);
  const agent = await signedInAs(t.app, users.buyer!.email);
  return agent;
}

async function directoryRow(agent: ReturnType<typeof agentFor>, technician: { id: number; name: string }) {
  const res = await agent.get("/api/directory").query({ q: technician.name, limit: 50 });
  expect(res.status).toBe(200);
  return res.body.rows.find((r: { technicianId: number }) => r.technicianId === technician.id);
}

describe("roster state on the technician page and in the directory", () => {
  it("remembers a rostered technician across fresh reads of the page and marks the directory row", async () => {
    const tech = listed()[0]!;
    const before = await buyer.get(`/api/directory/technicians/${tech.id}`);
    expect(before.body.roster).toEqual({ technicianEntryId: null, companyEntryId: null });
    expect((await directoryRow(buyer, tech)).onRoster).toBeNull();

    const added = await buyer.post("/api/roster").send({ technicianId: tech.id });
    expect(added.status).toBe(201);

    // A reload is a new request with nothing cached on the client: the page API itself must say so.
    const reloaded = await buyer.get(`/api/directory/technicians/${tech.id}`);
    expect(reloaded.status).toBe(200);
    expect(reloaded.body.roster).toEqual({ technicianEntryId: added.body.id, companyEntryId: null });
    expect((await directoryRow(buyer, tech)).onRoster).toBe("technician");
  });

  it("counts a whole-company entry for every technician of that company", async () => {
    const tech = listed().find((x) => x.id !== listed()[0]!.id && x.companyId !== listed()[0]!.companyId)!;
    const added = await buyer.post("/api/roster").send({ serviceCompanyId: tech.companyId });
    expect(added.status).toBe(201);

    const page = await buyer.get(`/api/directory/technicians/${tech.id}`);

    expect(page.body.roster).toEqual({ technicianEntryId: null, companyEntryId: added.body.id });
    expect((await directoryRow(buyer, tech)).onRoster).toBe("company");
  });

  it("tells another shop the same technician is not on its roster", async () => {
    const tech = listed()[0]!;
    const other = await otherShopBuyer();

    const page = await other.get(`/api/directory/technicians/${tech.id}`);

    expect(page.status).toBe(200);
    expect(page.body.roster).toEqual({ technicianEntryId: null, companyEntryId: null });
    expect((await directoryRow(other, tech)).onRoster).toBeNull();
  });
});
