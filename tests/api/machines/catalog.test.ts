import { beforeAll, describe, expect, it } from "vitest";
import { agentFor, useTestApp } from "../../support/test-app.ts";
import { signedInAgent } from "../../support/build-provider.ts";
import { useDirectoryWorld } from "../../support/directory-suite.ts";
import { bruteForceDirectory } from "../directory/brute-force-directory.ts";
import { readAllPages } from "../directory/directory-pages.ts";

const t = useTestApp();
const { world, buyer } = useDirectoryWorld(t, { seed: 11 });
let admin: ReturnType<typeof agentFor>;
beforeAll(async () => {
  admin = (await signedInAgent(t.app, "platform", "admin")).agent;
});

const ours = (ids: number[]) => {
  const mine = new Set(world.technicians.map((x) => x.id));
  return ids.filter((id) => mine.has(id)).sort((a, b) => a - b);
};

describe("machine catalog", () => {
  it("lists the seeded invented builders with their aliases to any signed-in user", async () => {
    const res = await buyer.get("/api/machine-catalog").query({ kind: "builder" });

    expect(res.status).toBe(200);
    const vantor = res.body.find((e: { name: string }) => e.name === "Vantor Machine Works");
    expect(vantor.aliases).toContain("Vantor");
    expect(res.body.every((e: { kind: string }) => e.kind === "builder")).toBe(true);
  });

  it("lets only an admin add or edit an entry", async () => {
    const entry = { kind: "builder", name: "Pellam Grinding Co", aliases: ["Pellam"] };
    expect((await buyer.post("/api/machine-catalog").send(entry)).status).toBe(403);

    const added = await admin.post("/api/machine-catalog").send(entry);
    expect(added.status).toBe(201);

    const edited = await admin
      .put(`/api/machine-catalog/${added.body.id}`)
      .send({ ...entry, aliases: ["Pellam", "PGC"] });
    expect(edited.status).toBe(200);
    const list = await buyer.get("/api/machine-catalog").query({ kind: "builder" });
    expect(list.body.find((e: { id: number }) => e.id === added.body.id).aliases).toEqual(["Pellam", "PGC"]);
    expect((await buyer.put(`/api/machine-catalog/${added.body.id}`).send(entry)).status).toBe(403);
  });

  it("refuses a name another entry already answers to, whatever its case or spacing (409 naming the field)", async () => {
    const res = await admin
      .post("/api/machine-catalog")
      .send({ kind: "builder", name: "Harlow Lathes", aliases: ["  vantor  "] });

    expect(res.status).toBe(409);
    expect(JSON.stringify(res.body)).toContain("body.aliases.0");
  });

  it("refuses an alias that repeats the entry's own name with 422", async () => {
    const res = await admin
      .post("/api/machine-catalog")
      .send({ kind: "builder", name: "Tamsin Tool", aliases: ["tamsin   TOOL"] });

    expect(res.status).toBe(422);
    expect(JSON.stringify(res.body)).toContain("aliases");
  });
});

describe("directory builder matching through the catalog", () => {
  it("finds a builder by alias and by its name typed in any case or spacing (common practice)", async () => {
    await admin
      .post("/api/machine-catalog")
      .send({ kind: "builder", name: "Quenby", aliases: ["Quenby Precision"] })
      .expect(201);
    const expected = bruteForceDirectory(world, { oemBuilder: "Quenby" }, new Date());
    expect(expected.length).toBeGreaterThan(0);

    for (const typed of ["quenby   PRECISION", "  QUENBY ", "Quenby"]) {
      const { rows } = await readAllPages(buyer, { oemBuilder: typed, limit: "50" });
      expect(ours(rows.map((r) => r.technicianId))).toEqual(expected);
    }
  });

  it("still finds nobody for a builder neither named nor aliased", async () => {
    const { rows } = await readAllPages(buyer, { oemBuilder: "Quen", limit: "50" });
    expect(ours(rows.map((r) => r.technicianId))).toEqual([]);
  });
});
