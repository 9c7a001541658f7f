/**
 * Server time of GET /api/directory over the test world, as a measurement (not a test): starts its own throw-away
 * PostgreSQL like the test suite, builds worlds, and prints p50/p95 per query shape.
 * Run: node --import tsx tests/api/directory/measure-directory-timing.ts [technicians=30]
 */
import { performance } from "node:perf_hooks";
import setup from "../../support/global-setup.ts";
import { agentFor, buildTestApp, sequelize } from "../../support/test-app.ts";
import { TEST_PASSWORD } from "../../support/build-company.ts";
import { buildDirectoryWorld } from "../../fixtures/build-directory-world.ts";
import { User } from "../../../server/accounts/model.ts";
import { searchDirectory } from "../../../server/directory/index.ts";
import { directoryQuerySchema } from "../../../shared/directory/schemas.ts";

const RUNS = 200;
const count = Number(process.argv[2] ?? 30);

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;
}

const teardown = await setup();
try {
  const t = buildTestApp();
  const world = await buildDirectoryWorld({ seed: 3, count, companies: Math.max(5, Math.ceil(count / 10)) });
  // Fresh bulk inserts have no planner statistics yet; a live database has them (autovacuum), so measure with them.
  await sequelize().query("ANALYZE");
  const buyer = agentFor(t.app);
  await buyer
    .post("/api/auth/sign-in")
    .send({ email: world.buyerEmail, password: TEST_PASSWORD })
    .expect(200);
  const shapes: Record<string, Record<string, string>> = {
    "no filter, by score": {},
    "site 100 miles, by distance": { siteId: String(world.site.id) },
    "site + arc flash + control family": {
      siteId: String(world.site.id),
      credentialTypes: "arc_flash",
      controlFamily: "K7",
    },
    "limits + rating + text, by rate": {
      minEachOccurrence: "1000000",
      minAutoCsl: "500000",
      minRating: "3",
      q: "a",
      sort: "hourlyRate",
    },
    "empty result (empty-state counts)": { siteId: String(world.site.id), q: "nobody-at-all" },
  };
  process.stdout.write(
    `GET /api/directory, ${world.technicians.length} technicians, ${RUNS} requests per shape (search = the route's use case with its SQL; whole request = supertest in-process incl. session)\n`,
  );
  const user = (await User.findOne({ where: { email: world.buyerEmail } }))!;
  const signedIn = {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    companyId: user.companyId,
    technicianId: null,
  };
  const line = (times: number[]) => {
    times.sort((a, b) => a - b);
    return `p50 ${percentile(times, 50).toFixed(2)} ms  p95 ${percentile(times, 95).toFixed(2)} ms`;
  };
  for (const [name, query] of Object.entries(shapes)) {
    for (let i = 0; i < 20; i += 1) await buyer.get("/api/directory").query(query); // warm-up: plans and pool
    const http: number[] = [];
    const service: number[] = [];
    const parsed = directoryQuerySchema.parse(query);
    for (let i = 0; i < RUNS; i += 1) {
      let start = performance.now();
      const res = await buyer.get("/api/directory").query(query);
      http.push(performance.now() - start);
      if (res.status !== 200) throw new Error(`${name}: ${res.status} ${JSON.stringify(res.body)}`);
      start = performance.now();
      await searchDirectory(signedIn, parsed);
      service.push(performance.now() - start);
    }
    process.stdout.write(`${name.padEnd(36)} search ${line(service)}   whole request ${line(http)}\n`);
  }
  await t.close();
} finally {
  teardown();
}
process.exit(0);
