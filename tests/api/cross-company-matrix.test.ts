import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { buildTestApp, type TestApp } from "../support/test-app.ts";
import { buildWorkOrderWorld, workOrderAt, type WorkOrderWorld } from "../fixtures/build-work-order-world.ts";
import { submitLiabilityCertificate } from "../support/submit-credential.ts";
import { routeTable } from "../../server/http/route.ts";
import { estimateBody, storeStandings, tinyPng } from "../fixtures/build-service-request-world.ts";
import type { Role } from "../../shared/accounts/schemas.ts";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../shared/api/error-body.ts";
import { atLeast, technicianViewLevel } from "../../shared/visibility/technician-visibility.ts";
import { sequelize } from "../support/test-app.ts";
import { signedInAgent } from "../support/build-provider.ts";
import { QueryTypes } from "sequelize";

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
  // A notification of the owner's buyer, so the signed-in "mark as read" route is walked with a real foreign id.
  const [notification] = await sequelize().query<{ id: number }>(
    `INSERT INTO notifications (user_id, kind, title, body, link) VALUES ($1, 'test', 'Spindle Works roster note', 'For the owner only', '/roster')
     RETURNING id`,
    { bind: [owner.shop.user.id], type: QueryTypes.SELECT },
  );
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
  const photo = await owner.shop.agent
    .post(`/api/machines/${owner.equipmentId}/photos`)
    .attach("file", tinyPng(), "nameplate.png");
  const buyingShop = await signedInAgent(t.app, "shop", "buyer");
  const transfer = await owner.shop.agent
    .post(`/api/machines/${owner.equipmentId}/transfers`)
    .send({ email: buyingShop.user.email });
  const plan = await owner.shop.agent.post(`/api/machines/${owner.equipmentId}/maintenance-plans`).send({
    name: "Annual inspection",
    intervalKind: "months",
    intervalMonths: 12,
    lastDoneOn: "2026-01-15",
  });
  Object.assign(ids, {
    notificationId: String(notification!.id),
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
    machineId: String(owner.equipmentId),
    entryId: String(entry.body.id),
    workOrderId: String(workOrderId),
    messageId: String(message.body.id),
    reviewId: String(review.body.id),
    photoId: String(photo.body.id),
    transferId: String(transfer.body.id),
    page: "1",
    planId: String(plan.body.id),
  });
}, 120_000);
afterAll(() => t.close());

// Shops may see another company's listed technician: the shared visibility rule decides what a shop of another company
// gets on a route about a technician (the owner's technician is listed: active with verified insurance).
const strangerShopSeesListed = atLeast(
  technicianViewLevel(
    { role: "buyer", sameCompany: false, isSelf: false, engaged: false },
    { active: true, baseline: "cleared" },
  ),
  "directory",
);
const openByRule = (role: Role, path: string) =>
  role === "buyer" && path.includes(":technicianId") && strangerShopSeesListed;

/** Routes any signed-in user may call, each role taking the part of the intruder. */
const SIGNED_IN_INTRUDERS: Role[] = ["provider_admin", "technician", "buyer"];

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

    // Owned routes, and signed-in routes that name a record in their path (each scopes it by the caller).
    const walked = routeTable.filter(
      (r) =>
        (r.policy.owns && Array.isArray(r.policy.roles)) ||
        (r.policy.roles === "signed_in" && /:[A-Za-z]+Id\b/.test(r.path)),
    );
    for (const route of walked) {
      const permitted =
        route.policy.roles === "signed_in" ? SIGNED_IN_INTRUDERS : (route.policy.roles as Role[]);
      for (const role of permitted.filter((r) => SIGNED_IN_INTRUDERS.includes(r))) {
        checked += 1;
        const foreign = await call(intruder(role), route.method, withIds(route.path, false));
        if (openByRule(role, route.path)) {
          if (foreign.status !== 200)
            wrong.push(`${role} ${route.method} ${route.path} -> ${foreign.status} (rule: visible)`);
          continue;
        }
        const missing = await call(intruder(role), route.method, withIds(route.path, true));
        if (foreign.status !== 404 || JSON.stringify(foreign.body) !== JSON.stringify(missing.body)) {
          wrong.push(
            `${role} ${route.method} ${route.path} -> ${foreign.status} (missing: ${missing.status})`,
          );
        }
      }
    }

    expect(Object.keys(ids).length).toBe(20);
    expect(walked.some((r) => r.policy.roles === "signed_in")).toBe(true);
    expect(checked).toBeGreaterThan(40);
    expect(wrong).toEqual([]);
  }, 120_000);

  it("never shows another company's names or e-mails on a signed-in route that takes no record id", async () => {
    const secrets = [
      owner.shop.company.name,
      owner.shop.user.email,
      owner.provider.company.name,
      owner.provider.technician.name,
      owner.provider.adminUser.email,
      "Spindle Works roster note",
    ];
    const leaks: string[] = [];
    let checked = 0;

    for (const route of routeTable.filter((r) => r.policy.roles === "signed_in" && r.method === "get")) {
      for (const role of SIGNED_IN_INTRUDERS) {
        checked += 1;
        const res = await call(
          intruder(role),
          route.method,
          withIds(route.path.replace(":code", "60601"), false),
        );
        const text = JSON.stringify(res.body);
        for (const secret of secrets)
          if (text.includes(secret)) leaks.push(`${role} ${route.path}: ${secret}`);
        if (res.status >= 400) leaks.push(`${role} ${route.path} -> ${res.status}`);
      }
    }

    expect(checked).toBeGreaterThanOrEqual(9);
    expect(leaks).toEqual([]);
  });

  it("still lets the owners themselves reach those records", async () => {
    const own = await owner.provider.admin.get(`/api/credentials/${ids.credentialId}`);
    const site = await owner.shop.agent.get(`/api/sites/${ids.siteId}`);
    const workOrder = await owner.provider.tech.get(`/api/work-orders/${ids.workOrderId}`);

    expect([own.status, site.status, workOrder.status]).toEqual([200, 200, 200]);
  });
});
