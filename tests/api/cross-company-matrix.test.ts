import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { buildTestApp, type TestApp } from "../support/test-app.ts";
import { buildWorkOrderWorld, workOrderAt, type WorkOrderWorld } from "../fixtures/build-work-order-world.ts";
import { submitLiabilityCertificate } from "../support/submit-credential.ts";
import { routeTable } from "../../server/http/route.ts";
import { estimateBody, storeStandings, tinyPng } from "../fixtures/build-service-request-world.ts";
import type { Role } from "../../shared/accounts/schemas.ts";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../shared/api/error-body.ts";

let t: TestApp;
let owner: WorkOrderWorld;
let other: WorkOrderWorld;
const ids: Record<string, string> = {};
beforeAll(async () => {
  t = buildTestApp();
  owner = await buildWorkOrderWorld(t.app);
  other = await buildWorkOrderWorld(t.app);
  const credential = await submitLiabilityCertificate(owner.provider.admin, 131);
  const set = await owner.shop.agent.post("/api/requirement-sets").send({
    name: "Spindle rebuilds",
    siteId: owner.siteId,
    requirements: [{ label: "General liability", typeCodes: ["general_liability"] }],
  });
  const entry = await owner.shop.agent
    .post("/api/roster")
    .send({ serviceCompanyId: owner.provider.company.id });
  const workOrderId = await workOrderAt(owner, "confirmed");
  const message = await owner.shop.agent
    .post(`/api/work-orders/${workOrderId}/messages`)
    .send({ body: "Machine is cooled down and locked out for you." });
  const review = await owner.shop.agent
    .post(`/api/work-orders/${workOrderId}/review`)
    .send({ stars: 5, body: "Found the encoder fault in an hour." });
  await storeStandings(owner.provider.company.id);
  const serviceRequest = await owner.shop.agent.post("/api/service-requests").send({
    siteId: owner.siteId,
    equipmentId: owner.equipmentId,
    kind: "repair",
    machineState: "down",
    problem: "won't power on",
    removeCompanyIds: [other.provider.company.id],
  });
  const requestId = serviceRequest.body.id as number;
  const attachment = await owner.shop.agent
    .post(`/api/service-requests/${requestId}/attachments`)
    .attach("file", tinyPng(), "panel.png");
  const estimate = await owner.provider.admin
    .post(`/api/service-requests/${requestId}/estimates`)
    .send(estimateBody({ technician: owner.provider.technician } as Parameters<typeof estimateBody>[0]));
  Object.assign(ids, {
    requestId: String(requestId),
    estimateId: String(estimate.body.estimates[0].id),
    attachmentId: String(attachment.body.id),
    companyId: String(owner.provider.company.id),
    technicianId: String(owner.provider.technician.id),
    credentialId: String(credential.id),
    documentId: String(credential.documentId),
    requirementSetId: String(set.body.id),
    siteId: String(owner.siteId),
    equipmentId: String(owner.equipmentId),
    entryId: String(entry.body.id),
    workOrderId: String(workOrderId),
    messageId: String(message.body.id),
    reviewId: String(review.body.id),
    page: "1",
  });
}, 120_000);
afterAll(() => t.close());

// Where a policy deliberately reaches across companies: buyers browse technicians of every service company.
const OPEN_BY_DESIGN = new Set([
  "buyer get /api/technicians/:technicianId",
  "buyer get /api/directory/technicians/:technicianId",
]);

const withIds = (path: string, missing: boolean) =>
  path.replace(/:([A-Za-z]+)/g, (_m, name: string) => (missing && name !== "page" ? "99999999" : ids[name]!));

function intruder(role: Role) {
  if (role === "provider_admin") return other.provider.admin;
  if (role === "technician") return other.provider.tech;
  return other.shop.agent;
}

function call(agent: ReturnType<typeof request.agent>, method: string, path: string) {
  return (agent as unknown as Record<string, (p: string) => request.Test>)[method]!(path)
    .set(CSRF_HEADER, CSRF_HEADER_VALUE)
    .send({});
}

describe("another company's records", () => {
  it("answer every permitted role of another company exactly as a missing id would, on every owned route", async () => {
    const wrong: string[] = [];
    let checked = 0;

    for (const route of routeTable.filter((r) => r.policy.owns && Array.isArray(r.policy.roles))) {
      for (const role of (route.policy.roles as Role[]).filter(
        (r) => r === "provider_admin" || r === "technician" || r === "buyer",
      )) {
        if (OPEN_BY_DESIGN.has(`${role} ${route.method} ${route.path}`)) continue;
        checked += 1;
        const foreign = await call(intruder(role), route.method, withIds(route.path, false));
        const missing = await call(intruder(role), route.method, withIds(route.path, true));
        if (foreign.status !== 404 || JSON.stringify(foreign.body) !== JSON.stringify(missing.body)) {
          wrong.push(
            `${role} ${route.method} ${route.path} -> ${foreign.status} (missing: ${missing.status})`,
          );
        }
      }
    }

    expect(Object.keys(ids).length).toBe(15);
    expect(checked).toBeGreaterThan(40);
    expect(wrong).toEqual([]);
  }, 120_000);

  it("still lets the owners themselves reach those records", async () => {
    const own = await owner.provider.admin.get(`/api/credentials/${ids.credentialId}`);
    const site = await owner.shop.agent.get(`/api/sites/${ids.siteId}`);
    const workOrder = await owner.provider.tech.get(`/api/work-orders/${ids.workOrderId}`);

    expect([own.status, site.status, workOrder.status]).toEqual([200, 200, 200]);
  });
});
