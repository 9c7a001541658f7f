import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Role } from "../../shared/accounts/schemas.ts";
import { db } from "../../server/db/sequelize.ts";
import { migrate } from "../../server/db/migrate.ts";
import { DEMO_PASSWORD, demoSignIns, loadDemoScenarioOnce } from "../../server/db/demo-scenario/index.ts";
import { routeTable, type RouteEntry } from "../../server/http/route.ts";
import { agentFor, buildTestApp, type TestApp } from "../support/test-app.ts";
import { createTestDatabase } from "../support/test-database.ts";

// Answers that are not JSON, so no response schema applies: files, CSV, ICS, print pages, redirects.
const notJson = new Set([
  "get /api/technicians/import/template", // XLSX workbook
  "get /api/machines/import/template", // XLSX workbook
  "get /api/documents/:documentId/file", // the uploaded PDF or image
  "get /api/documents/:documentId/pages/:page", // a page image
  "get /api/roster/export.csv", // CSV
  "get /api/machines/:machineId/history.csv", // CSV
  "get /api/machines/:machineId/history/print", // HTML print page
  "get /api/work-orders/:workOrderId/standing-proof", // HTML print page
  "get /api/machines/:machineId/photos/:photoId", // image
  "get /api/work-orders/:workOrderId/messages/:messageId/file", // attachment
  "get /api/work-orders/:workOrderId/messages/:messageId/thumbnail", // image
  "get /api/service-requests/:requestId/attachments/:attachmentId", // attachment
  "get /api/service-requests/:requestId/threads/:companyId/messages/:messageId/file", // attachment
  "get /api/calendar/:secret.ics", // ICS
]);

// Writes whose success is the status alone (204 No Content): nothing for a schema to describe. The route table's shape
// check also refuses a JSON answer from any route without a schema, so a route on this list cannot start sending one.
const answersNothing = new Set([
  "post /api/auth/sign-out",
  "post /api/auth/set-password",
  "delete /api/sites/:siteId",
  "delete /api/sites/:siteId/equipment/:equipmentId",
  "delete /api/roster/:entryId",
  "delete /api/broker-contacts/:typeCode",
  "delete /api/machines/:machineId/photos/:photoId",
  "delete /api/machines/:machineId/maintenance-plans/:planId",
]);

const key = (r: RouteEntry) => `${r.method} ${r.path}`;

let t: TestApp;
let uploadsDir: string;
const agents = new Map<Role, ReturnType<typeof agentFor>[]>();

const ids = async (sql: string) =>
  (await db().query<{ id: number | string }>(sql, { type: QueryTypes.SELECT })).map((r) => String(r.id));

// Real values from the demo data for each path parameter; the caller's own rows are found by trying them.
let candidates: Record<string, string[]>;
// The query a route needs to answer at all, by route.
const queryOf = new Map<string, string>();

beforeAll(async () => {
  const { url } = await createTestDatabase("shapes");
  uploadsDir = mkdtempSync(path.join(tmpdir(), "clearbench-shapes-uploads-"));
  t = buildTestApp({ DATABASE_URL: url, UPLOADS_DIR: uploadsDir });
  await migrate(db());
  expect(await loadDemoScenarioOnce({ uploadsDir, today: new Date() })).toBe(true);
  // One signed-in agent per demo account, so each role is tried from every company it belongs to.
  for (const { role, email } of demoSignIns) {
    const agent = agentFor(t.app);
    await agent.post("/api/auth/sign-in").send({ email, password: DEMO_PASSWORD }).expect(200);
    agents.set(role, [...(agents.get(role) ?? []), agent]);
  }
  candidates = {
    technicianId: await ids("SELECT id FROM technicians ORDER BY id"),
    requirementSetId: await ids("SELECT id FROM requirement_sets ORDER BY id"),
    credentialId: await ids("SELECT id FROM credentials ORDER BY id LIMIT 40"),
    siteId: await ids("SELECT id FROM sites ORDER BY id"),
    workOrderId: await ids("SELECT id FROM work_orders ORDER BY id"),
    requestId: await ids("SELECT id FROM service_requests ORDER BY id"),
    machineId: await ids("SELECT id FROM equipment ORDER BY id"),
    transferId: await ids("SELECT id FROM machine_transfers ORDER BY id"),
    code: await ids("SELECT DISTINCT postal_code AS id FROM sites"),
    zip: await ids("SELECT DISTINCT postal_code AS id FROM sites"),
  };
}, 240_000);

// Path values the demo data has no row or column for: each thread is named by an invited company, and an upload link
// and a machine transfer are made through the product's own API so their answers are parsed for real.
beforeAll(async () => {
  candidates.companyId = await ids(
    "SELECT DISTINCT company_id AS id FROM service_request_invitations ORDER BY 1",
  );

  const office = agents.get("provider_admin")![0]!;
  const brokerEmail = "broker-shapes@agency.example.test";
  await office
    .put("/api/broker-contacts")
    .send({ agency: "Harrow Lane Insurance Agency", contactName: "Odile Prentiss", email: brokerEmail })
    .expect(200);
  await office.post("/api/broker-requests").send({ typeCode: "general_liability" }).expect(201);
  // The link exists only in the e-mail to the broker, so it is read from the queued message.
  const [mail] = await db().query<{ text_body: string }>(
    "SELECT text_body FROM outbox_messages WHERE to_address = $1 ORDER BY id DESC LIMIT 1",
    { bind: [brokerEmail], type: QueryTypes.SELECT },
  );
  const token = /\/broker-upload\/([A-Za-z0-9_-]+)/.exec(mail?.text_body ?? "")?.[1];
  expect(token).toBeDefined();
  candidates.token = [token!];

  const [seller, receiver] = agents.get("buyer")!;
  const [machine] = (await seller!.get("/api/machines").expect(200)).body as { id: number }[];
  const receiverEmail = ((await receiver!.get("/api/auth/me").expect(200)).body as { email: string }).email;
  await seller!
    .post(`/api/machines/${machine!.id}/transfers`)
    .send({ email: receiverEmail, note: "Sold with the spare chuck" })
    .expect(201);
  candidates.transferId = await ids("SELECT id FROM machine_transfers ORDER BY id");

  // The gate check reads its badge code from the query: a technician's badge opened from one of the shop's gate signs.
  const [site] = (await seller!.get("/api/sites").expect(200)).body as { id: number }[];
  const sign = (await seller!.get(`/api/sites/${site!.id}/gate-sign`).expect(200)).body as { code: string };
  const technician = agents.get("technician")![0]!;
  const badge = (await technician.get(`/api/badge?site=${encodeURIComponent(sign.code)}`).expect(200))
    .body as { url: string };
  queryOf.set("get /api/gate/check", new URL(badge.url).search);
}, 60_000);

afterAll(async () => {
  await t?.close();
  if (uploadsDir) rmSync(uploadsDir, { recursive: true, force: true });
});

/** Every concrete path for a route, filling each parameter with each real value. */
function concretePaths(route: string): string[] {
  const names = [...route.matchAll(/:([A-Za-z]+)/g)].map((m) => m[1]!);
  let paths = [route];
  for (const name of names) {
    const values = candidates[name] ?? [];
    paths = paths.flatMap((p) => values.map((v) => p.replace(`:${name}`, encodeURIComponent(v))));
  }
  return paths;
}

const rolesOf = (r: RouteEntry): readonly Role[] =>
  r.policy.roles === "anyone" || r.policy.roles === "signed_in" ? [...agents.keys()] : r.policy.roles;

describe("response shapes on the demo data", () => {
  it("declares a response schema for every JSON route (the rest are listed as files or pages)", () => {
    const gets = routeTable.filter((r) => r.method === "get");
    const missing = gets.filter((r) => !r.response && !notJson.has(key(r)));
    // A listed file or page route that now declares a schema, or no longer exists, is a stale line.
    const stale = [...notJson].filter((k) => gets.some((r) => key(r) === k && r.response));
    const unknown = [...notJson].filter((k) => !gets.some((r) => key(r) === k));
    // Writes answer either a declared shape or nothing at all (204); the list of bodiless ones is closed too.
    const writes = routeTable.filter((r) => r.method !== "get");
    const undeclaredWrites = writes.filter((r) => !r.response && !answersNothing.has(key(r)));
    const noLongerBodiless = [...answersNothing].filter(
      (k) => !writes.some((r) => key(r) === k && !r.response),
    );
    expect(undeclaredWrites.map(key)).toEqual([]);
    expect(noLongerBodiless).toEqual([]);

    expect(missing.map(key)).toEqual([]);
    expect(stale).toEqual([]);
    expect(unknown).toEqual([]);
  });

  it("answers every declared GET route, for each role it allows, with exactly its schema's shape", async () => {
    const wrong: string[] = [];
    const answered = new Set<string>();
    const declared = routeTable.filter((r) => r.method === "get" && r.response);
    for (const route of declared) {
      for (const role of rolesOf(route)) {
        for (const agent of agents.get(role) ?? []) {
          for (const concrete of concretePaths(route.path)) {
            const res = await agent.get(concrete + (queryOf.get(key(route)) ?? ""));
            if (res.status !== 200) continue;
            answered.add(key(route));
            const parsed = route.response!.safeParse(res.body);
            if (!parsed.success)
              wrong.push(
                `${role} ${concrete}: ${parsed.error.issues[0]?.path.join(".")} ${parsed.error.message}`,
              );
            // Parsing strips what the schema does not name, so an answer with an extra field differs from its parse.
            else
              try {
                expect(parsed.data).toStrictEqual(res.body);
              } catch {
                wrong.push(`${role} ${concrete}: carries fields its schema does not declare`);
              }
            break;
          }
        }
      }
    }

    expect(declared.length).toBeGreaterThan(0);
    expect(wrong).toEqual([]);
    expect(declared.map(key).filter((k) => !answered.has(k))).toEqual([]);
  }, 240_000);
});
