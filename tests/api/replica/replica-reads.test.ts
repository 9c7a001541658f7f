import { afterAll, beforeAll, describe, expect, it } from "vitest";
import pg from "pg";
import request from "supertest";
import { agentFor, buildTestApp, type TestApp, signedInAs } from "../../support/test-app.ts";
import { startReplicatedPostgres, type ReplicatedPostgres } from "../../support/replicated-postgres.ts";
import { buildDirectoryWorld, type DirectoryWorld } from "../../fixtures/build-directory-world.ts";
import { closeReplica, connectReplica } from "../../../server/db/replica.ts";
import { bruteForceDirectory } from "../directory/brute-force-directory.ts";
import { readAllPages } from "../directory/directory-pages.ts";

// Streaming replication: a hot standby answers read-only queries and lags the primary (PostgreSQL 16 docs §27.4
// "Hot Standby"); pg_wal_replay_pause() holds it at a known point, so what a read returns shows who answered it.
let cluster: ReplicatedPostgres;
let t: TestApp;
let strict: TestApp;
let before: DirectoryWorld;
let after: DirectoryWorld;

const listed = (world: DirectoryWorld) => bruteForceDirectory(world, {}, new Date());
const plant = { name: "Replica Plant", addressLine: "12 Spindle Road", postalCode: "60601" };

async function signIn(app: TestApp, world: DirectoryWorld) {
  const agent = await signedInAs(app.app, world.buyerEmail);
  return agent;
}

async function seen(agent: ReturnType<typeof agentFor>, world: DirectoryWorld) {
  const { rows } = await readAllPages(agent, { limit: "50" });
  const ids = new Set(rows.map((r) => r.technicianId));
  return listed(world).filter((id) => ids.has(id));
}

async function onPrimary<T>(sql: string, values: unknown[]): Promise<T[]> {
  const client = new pg.Client({ connectionString: cluster.primaryUrl });
  await client.connect();
  try {
    return (await client.query(sql, values)).rows as T[];
  } finally {
    await client.end();
  }
}

beforeAll(async () => {
  cluster = await startReplicatedPostgres();
  t = buildTestApp({ DATABASE_URL: cluster.primaryUrl, READ_YOUR_WRITES_SECONDS: "30" });
  strict = buildTestApp({ DATABASE_URL: cluster.primaryUrl, READ_YOUR_WRITES_SECONDS: "0" });
  connectReplica(cluster.replicaUrl);
  before = await buildDirectoryWorld({ seed: 11, count: 8 });
  await cluster.catchUp();
  await cluster.pauseReplay();
  // Written on the primary only: the paused replica cannot know these technicians yet.
  after = await buildDirectoryWorld({ seed: 12, count: 8 });
}, 120_000);

afterAll(async () => {
  await t?.close();
  await strict?.close();
  await closeReplica();
  cluster?.stop();
});

describe("reads from a streaming replica", () => {
  it("has listed technicians in both worlds, so each check below can fail", () => {
    expect(listed(before).length).toBeGreaterThan(0);
    expect(listed(after).length).toBeGreaterThan(0);
  });

  it("answers the directory search from the replica for a session that has not written", async () => {
    const buyer = await signIn(t, after);
    expect(await seen(buyer, before)).toEqual(listed(before));
    expect(await seen(buyer, after)).toEqual([]);
  });

  it("answers the directory's technician page from the replica too", async () => {
    const buyer = await signIn(t, before);
    const [known] = listed(before);
    const [unreplayed] = listed(after);
    await buyer.get(`/api/directory/technicians/${known}`).expect(200);
    await buyer.get(`/api/directory/technicians/${unreplayed}`).expect(404);
  });

  it("sends writes to the primary, and the writer's next reads there (read-your-writes)", async () => {
    const buyer = await signIn(t, after);
    const site = (await buyer.post("/api/sites").send(plant).expect(201)).body as { id: number };
    const rows = await onPrimary<{ id: number }>("SELECT id FROM sites WHERE id = $1", [site.id]);
    expect(rows).toHaveLength(1);

    const sites = await buyer.get("/api/sites").expect(200);
    expect(JSON.stringify(sites.body)).toContain(plant.name);
    // The directory can be searched from the site just saved, and the writer's search now knows the newer
    // technicians the paused replica has not replayed: it was read from the primary.
    await readAllPages(buyer, { siteId: String(site.id) });
    expect(await seen(buyer, after)).toEqual(listed(after));
  });

  it("keeps reading from the replica after a write when READ_YOUR_WRITES_SECONDS is 0", async () => {
    const buyer = await signIn(strict, after);
    await buyer
      .post("/api/sites")
      .send({ ...plant, name: "Second Plant" })
      .expect(201);
    expect(await seen(buyer, after)).toEqual([]);
  });

  it("reports the replica in readiness while it is up", async () => {
    const res = await request(t.app).get("/api/health/ready").expect(200);
    expect(res.body).toMatchObject({ status: "ok", database: "up", replica: "up" });
  });

  it("keeps serving from the primary when the replica stops, and stays ready", async () => {
    await cluster.resumeReplay();
    cluster.stopReplica();
    const buyer = await signIn(t, before);
    expect(await seen(buyer, after)).toEqual(listed(after));
    await buyer.get(`/api/directory/technicians/${listed(after)[0]}`).expect(200);
    const res = await request(t.app).get("/api/health/ready").expect(200);
    expect(res.body).toMatchObject({ status: "ok", database: "up", replica: "down" });
  });
});
