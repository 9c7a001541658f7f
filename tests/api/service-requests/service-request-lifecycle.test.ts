import { describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { sequelize, useTestApp } from "../../support/test-app.ts";
import {
  buildClearedCompany,
  buildShop,
  estimateBody,
  onlyInvite,
  raiseRequest,
  requestBody,
  tinyPng,
} from "../../fixtures/build-service-request-world.ts";

const t = useTestApp();

async function rows<T extends object>(sql: string, bind: unknown[]) {
  return sequelize().query<T>(sql, { bind, type: QueryTypes.SELECT });
}

async function twoCompanyRequest() {
  const shop = await buildShop(t.app);
  const a = await buildClearedCompany(t.app);
  const b = await buildClearedCompany(t.app);
  const request = await raiseRequest(shop, await onlyInvite(shop, [a.company.id, b.company.id]));
  return { shop, a, b, request };
}

describe("raising a service request", () => {
  it("previews the companies it will reach and invites exactly those, telling each in the app and by e-mail", async () => {
    const shop = await buildShop(t.app);
    const a = await buildClearedCompany(t.app);

    const preview = await shop.agent.post("/api/service-requests/preview").send(requestBody(shop));
    const created = await raiseRequest(shop);

    expect(preview.status).toBe(200);
    expect(preview.body.count).toBe(preview.body.companies.length);
    expect(preview.body.companies.map((c: { companyId: number }) => c.companyId)).toContain(a.company.id);
    const invited = created.invitations.map((i) => i.companyId);
    expect(invited).toContain(a.company.id);
    const [notification] = await rows<{ title: string }>(
      "SELECT title FROM notifications WHERE user_id = $1 AND kind = 'service_request.invited' ORDER BY id DESC LIMIT 1",
      [a.adminUser.id],
    );
    expect(notification?.title).toContain(`#${created.id}`);
    const mail = await rows<{ subject: string }>(
      "SELECT subject FROM outbox_messages WHERE to_address = $1",
      [a.adminUser.email],
    );
    expect(mail.some((m) => m.subject.includes(`#${created.id}`))).toBe(true);
  });

  it("never invites a company whose only technician is not cleared, even when the buyer adds it from the roster", async () => {
    const shop = await buildShop(t.app);
    const lapsed = await buildClearedCompany(t.app);
    await sequelize().query(
      "UPDATE technician_standings SET standing = 'not_cleared' WHERE technician_id = $1",
      { bind: [lapsed.technician.id] },
    );
    await sequelize().query(
      "INSERT INTO roster_entries (shop_company_id, service_company_id, added_by) VALUES ($1, $2, $3)",
      { bind: [shop.company.id, lapsed.company.id, shop.user.id] },
    );

    const preview = await shop.agent
      .post("/api/service-requests/preview")
      .send(requestBody(shop, { addCompanyIds: [lapsed.company.id] }));
    const raise = await shop.agent
      .post("/api/service-requests")
      .send(requestBody(shop, { addCompanyIds: [lapsed.company.id] }));

    expect(preview.body.companies.map((c: { companyId: number }) => c.companyId)).not.toContain(
      lapsed.company.id,
    );
    expect(preview.body.refused).toEqual([
      { companyId: lapsed.company.id, reason: "no technician cleared for this requirement set today" },
    ]);
    expect(raise.status).toBe(422);
  });

  it("invites a roster company outside the routing when the buyer adds it and it has a cleared technician", async () => {
    const shop = await buildShop(t.app);
    const far = await buildClearedCompany(t.app);
    // Based in Denver: far outside its own 150 km radius of the Chicago site.
    await sequelize().query(
      "UPDATE technicians SET latitude = 39.74, longitude = -104.99 WHERE company_id = $1",
      {
        bind: [far.company.id],
      },
    );
    await sequelize().query(
      "INSERT INTO roster_entries (shop_company_id, service_company_id, added_by) VALUES ($1, $2, $3)",
      { bind: [shop.company.id, far.company.id, shop.user.id] },
    );

    const before = await shop.agent.post("/api/service-requests/preview").send(requestBody(shop));
    const created = await raiseRequest(shop, { addCompanyIds: [far.company.id] });

    expect(before.body.companies.map((c: { companyId: number }) => c.companyId)).not.toContain(
      far.company.id,
    );
    expect(created.invitations).toContainEqual(
      expect.objectContaining({ companyId: far.company.id, source: "buyer" }),
    );
  });

  it("refuses a window whose end is before its start, naming the field", async () => {
    const shop = await buildShop(t.app);

    const res = await shop.agent
      .post("/api/service-requests")
      .send(requestBody(shop, { timing: "window", windowStart: "2027-01-10", windowEnd: "2027-01-05" }));

    expect(res.status).toBe(422);
    expect(res.body.error.fields).toContainEqual(expect.objectContaining({ path: "body.windowEnd" }));
  });

  it("keeps a photo attached to the request, typed by its bytes, and shows it to an invited company", async () => {
    const { shop, a, request } = await twoCompanyRequest();

    const upload = await shop.agent
      .post(`/api/service-requests/${request.id}/attachments`)
      .attach("file", tinyPng(), "spindle.png");
    const seen = await a.admin.get(`/api/service-requests/${request.id}`);
    const download = await a.admin.get(upload.body.url).buffer(true);

    expect(upload.status).toBe(201);
    expect(seen.body.attachments).toEqual([
      expect.objectContaining({ name: "spindle.png", mime: "image/png" }),
    ]);
    expect(download.headers["content-type"]).toBe("image/png");
  });

  it("answers 415 to a page named .png and keeps no attachment row", async () => {
    const { shop, request } = await twoCompanyRequest();

    const res = await shop.agent
      .post(`/api/service-requests/${request.id}/attachments`)
      .attach("file", Buffer.from("<html><script>alert(1)</script></html>"), "photo.png");
    const kept = await rows("SELECT id FROM service_request_attachments WHERE request_id = $1", [request.id]);

    expect(res.status).toBe(415);
    expect(kept).toEqual([]);
  });
});

describe("what an invited company sees", () => {
  it("shows the city, state and ZIP but not the street or site name before the decision", async () => {
    const { a, request } = await twoCompanyRequest();

    const seen = await a.admin.get(`/api/service-requests/${request.id}`);

    expect(seen.status).toBe(200);
    expect(seen.body.site).toMatchObject({
      city: "Chicago",
      state: "IL",
      postalCode: "60601",
      street: null,
      name: null,
    });
    expect(seen.body.actions.sort()).toEqual(["estimate", "message", "pass"]);
    expect(seen.body.invitations).toHaveLength(1);
  });

  it("answers 404 to a company that was not invited, for the request and for an estimate", async () => {
    const { request } = await twoCompanyRequest();
    const outsider = await buildClearedCompany(t.app);

    const seen = await outsider.admin.get(`/api/service-requests/${request.id}`);
    const sent = await outsider.admin
      .post(`/api/service-requests/${request.id}/estimates`)
      .send(estimateBody(outsider));

    expect(seen.status).toBe(404);
    expect(sent.status).toBe(404);
  });
});

describe("estimates", () => {
  it("computes the total in whole cents from its parts, before tax, and keeps every revision", async () => {
    const { a, request } = await twoCompanyRequest();

    const first = await a.admin.post(`/api/service-requests/${request.id}/estimates`).send(estimateBody(a));
    const estimateId = first.body.estimates[0].id as number;
    const revised = await a.admin
      .put(`/api/service-requests/${request.id}/estimates/${estimateId}`)
      .send(estimateBody(a, { onSiteHours: 4 }));

    expect(first.status).toBe(201);
    const current = revised.body.estimates[0].current;
    expect(current.revision).toBe(2);
    expect(revised.body.estimates[0].revisions.map((r: { revision: number }) => r.revision)).toEqual([1, 2]);
    expect(current.total.labourCents).toBe(4 * 14_500);
    expect(current.total.partsCents).toBe(4_200);
    expect(current.total.totalCents).toBe(
      current.total.travelCents +
        current.total.labourCents +
        current.total.mileageCents +
        current.total.partsCents,
    );
    expect(current.total.basis).toBe("before tax");
    expect(revised.body.actions.sort()).toEqual(["message", "revise", "withdraw"]);
  });

  it("answers 409 naming the unmet requirement when the technician is not cleared as the estimate is sent", async () => {
    const { a, request } = await twoCompanyRequest();
    await sequelize().query(
      "UPDATE credentials SET state = 'lapsed' WHERE company_id = $1 AND type_code = 'general_liability'",
      {
        bind: [a.company.id],
      },
    );

    const res = await a.admin.post(`/api/service-requests/${request.id}/estimates`).send(estimateBody(a));

    expect(res.status).toBe(409);
    expect(res.body.error.fields.map((f: { message: string }) => f.message).join(" ")).toContain(
      "General liability",
    );
  });

  it("refuses another company's technician with 422 on the field", async () => {
    const { a, b, request } = await twoCompanyRequest();

    const res = await a.admin
      .post(`/api/service-requests/${request.id}/estimates`)
      .send(estimateBody(a, { technicianId: b.technician.id }));

    expect(res.status).toBe(422);
    expect(res.body.error.fields[0].path).toBe("body.technicianId");
  });

  it("records a pass with its reason and the first answer time", async () => {
    const { shop, a, request } = await twoCompanyRequest();

    const res = await a.admin
      .post(`/api/service-requests/${request.id}/pass`)
      .send({ reason: "No one free this week" });
    const shopView = await shop.agent.get(`/api/service-requests/${request.id}`);

    expect(res.status).toBe(200);
    const invitation = shopView.body.invitations.find(
      (i: { companyId: number }) => i.companyId === a.company.id,
    );
    expect(invitation).toMatchObject({ answer: "pass", passReason: "No one free this week" });
    expect(invitation.firstAnswerAt).not.toBeNull();
  });

  it("withdraws an estimate, which then leaves the comparison", async () => {
    const { shop, a, request } = await twoCompanyRequest();
    const sent = await a.admin.post(`/api/service-requests/${request.id}/estimates`).send(estimateBody(a));
    const estimateId = sent.body.estimates[0].id as number;

    const res = await a.admin.post(`/api/service-requests/${request.id}/estimates/${estimateId}/withdraw`);
    const comparison = await shop.agent.get(`/api/service-requests/${request.id}/comparison`);
    const accept = await shop.agent.post(
      `/api/service-requests/${request.id}/estimates/${estimateId}/accept`,
    );

    expect(res.body.estimates[0].status).toBe("withdrawn");
    expect(comparison.body.rows).toEqual([]);
    expect(accept.status).toBe(409);
  });
});

describe("comparing and deciding", () => {
  it("compares estimates with standing, distance, arrival, total, rating and response time", async () => {
    const { shop, a, b, request } = await twoCompanyRequest();
    await a.admin.post(`/api/service-requests/${request.id}/estimates`).send(estimateBody(a));
    await b.admin
      .post(`/api/service-requests/${request.id}/estimates`)
      .send(estimateBody(b, { onSiteHours: 2 }));

    const res = await shop.agent.get(`/api/service-requests/${request.id}/comparison`);

    expect(res.status).toBe(200);
    expect(res.body.rows).toHaveLength(2);
    const row = res.body.rows.find((r: { companyId: number }) => r.companyId === b.company.id);
    expect(row).toMatchObject({ standing: "cleared", acceptedEstimates: 0, rating: { count: 0 } });
    expect(row.requirements.length).toBeGreaterThan(0);
    expect(row.medianResponseMinutes).not.toBeNull();
    expect(row.total.labourCents).toBe(2 * 14_500);
  });

  it("shows the same typical response time on the technician's profile as in the comparison", async () => {
    const { shop, a, request } = await twoCompanyRequest();
    await sequelize().query(
      "UPDATE service_request_invitations SET invited_at = now() - interval '95 minutes' WHERE request_id = $1",
      { bind: [request.id] },
    );
    await a.admin.post(`/api/service-requests/${request.id}/estimates`).send(estimateBody(a)).expect(201);

    const comparison = await shop.agent.get(`/api/service-requests/${request.id}/comparison`);
    const profile = await shop.agent.get(`/api/directory/technicians/${a.technician.id}`);

    expect(comparison.body.rows[0].medianResponseMinutes).toBe(95);
    expect(profile.body.companyMedianResponseMinutes).toBe(95);
  });

  it("answers 403 to a service company and 404 to another shop for the comparison", async () => {
    const { a, request } = await twoCompanyRequest();
    const otherShop = await buildShop(t.app);

    const company = await a.admin.get(`/api/service-requests/${request.id}/comparison`);
    const shop = await otherShop.agent.get(`/api/service-requests/${request.id}/comparison`);

    expect(company.status).toBe(403);
    expect(shop.status).toBe(404);
  });

  it("accepts one estimate: an accepted work order with the standing snapshot, the chosen company told, the other thanked", async () => {
    const { shop, a, b, request } = await twoCompanyRequest();
    const sentA = await a.admin.post(`/api/service-requests/${request.id}/estimates`).send(estimateBody(a));
    await b.admin.post(`/api/service-requests/${request.id}/estimates`).send(estimateBody(b));
    const estimateId = sentA.body.estimates[0].id as number;

    const res = await shop.agent.post(`/api/service-requests/${request.id}/estimates/${estimateId}/accept`);
    const workOrder = await a.admin.get(`/api/work-orders/${res.body.workOrderId}`);
    const chosenView = await a.admin.get(`/api/service-requests/${request.id}`);
    const otherView = await b.admin.get(`/api/service-requests/${request.id}`);
    const told = await rows<{ kind: string; user_id: number }>(
      "SELECT kind, user_id FROM notifications WHERE user_id = ANY($1::int[]) AND kind IN ('service_request.accepted','service_request.not_chosen')",
      [[a.adminUser.id, b.adminUser.id]],
    );

    expect(res.status).toBe(200);
    expect(res.body.status).toBe("decided");
    expect(workOrder.status).toBe(200);
    expect(workOrder.body.status).toBe("accepted");
    expect(workOrder.body.snapshotAccepted).toMatchObject({
      technicianId: a.technician.id,
      standing: "cleared",
    });
    expect(workOrder.body.technician?.id ?? workOrder.body.technicianId).toBe(a.technician.id);
    expect(chosenView.body.site.street).toBe("77 Millrace Court");
    expect(otherView.body.site.street).toBeNull();
    expect(otherView.body.estimates[0].status).toBe("not_chosen");
    expect(otherView.body.workOrderId).toBeNull();
    expect(told).toContainEqual({ kind: "service_request.accepted", user_id: a.adminUser.id });
    expect(told).toContainEqual({ kind: "service_request.not_chosen", user_id: b.adminUser.id });
  });

  it("answers 409 to a revision, a withdrawal, a pass and a message after the decision", async () => {
    const { shop, a, b, request } = await twoCompanyRequest();
    const sentA = await a.admin.post(`/api/service-requests/${request.id}/estimates`).send(estimateBody(a));
    const sentB = await b.admin.post(`/api/service-requests/${request.id}/estimates`).send(estimateBody(b));
    const idA = sentA.body.estimates[0].id as number;
    const idB = sentB.body.estimates[0].id as number;
    await shop.agent.post(`/api/service-requests/${request.id}/estimates/${idA}/accept`).expect(200);

    const revise = await b.admin
      .put(`/api/service-requests/${request.id}/estimates/${idB}`)
      .send(estimateBody(b));
    const withdraw = await b.admin.post(`/api/service-requests/${request.id}/estimates/${idB}/withdraw`);
    const message = await b.admin
      .post(`/api/service-requests/${request.id}/threads/${b.company.id}`)
      .send({ body: "Still free?" });
    const cancel = await shop.agent
      .post(`/api/service-requests/${request.id}/cancel`)
      .send({ reason: "Changed our mind" });

    expect([revise.status, withdraw.status, message.status, cancel.status]).toEqual([409, 409, 409, 409]);
  });

  it("lets one of two buyers accepting two estimates at once win; the other gets 409 and one work order exists", async () => {
    const { shop, a, b, request } = await twoCompanyRequest();
    const second = await buildShopColleague(shop.company.id);
    const sentA = await a.admin.post(`/api/service-requests/${request.id}/estimates`).send(estimateBody(a));
    const sentB = await b.admin.post(`/api/service-requests/${request.id}/estimates`).send(estimateBody(b));

    const results = await Promise.all([
      shop.agent.post(`/api/service-requests/${request.id}/estimates/${sentA.body.estimates[0].id}/accept`),
      second.post(`/api/service-requests/${request.id}/estimates/${sentB.body.estimates[0].id}/accept`),
    ]);
    const [stored] = await rows<{ n: number }>(
      "SELECT count(*)::int AS n FROM work_orders WHERE problem LIKE $1",
      [`%service request #${request.id})%`],
    );

    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
    expect(stored?.n).toBe(1);
  });

  it("cancels with a reason and tells every invited company", async () => {
    const { shop, a, b, request } = await twoCompanyRequest();

    const res = await shop.agent
      .post(`/api/service-requests/${request.id}/cancel`)
      .send({ reason: "Fixed it ourselves" });
    const told = await rows<{ user_id: number }>(
      "SELECT user_id FROM notifications WHERE kind = 'service_request.cancelled' AND user_id = ANY($1::int[])",
      [[a.adminUser.id, b.adminUser.id]],
    );

    expect(res.body).toMatchObject({ status: "cancelled", cancelReason: "Fixed it ourselves" });
    expect(told).toHaveLength(2);
  });
});

describe("the message thread of each company", () => {
  it("keeps each company's thread from the other companies", async () => {
    const { shop, a, b, request } = await twoCompanyRequest();

    const posted = await a.admin
      .post(`/api/service-requests/${request.id}/threads/${a.company.id}`)
      .send({ body: "Is the spindle drive alarm 2041?" });
    const reply = await shop.agent
      .post(`/api/service-requests/${request.id}/threads/${a.company.id}`)
      .field("body", "Yes, photo attached")
      .attach("file", tinyPng(), "alarm.png");
    const own = await a.admin.get(`/api/service-requests/${request.id}/threads/${a.company.id}`);
    const peek = await b.admin.get(`/api/service-requests/${request.id}/threads/${a.company.id}`);

    expect(posted.status).toBe(201);
    expect(reply.body.attachment).toMatchObject({ name: "alarm.png", mime: "image/png" });
    expect(own.body.map((m: { side: string }) => m.side)).toEqual(["service", "shop"]);
    expect(peek.status).toBe(404);
  });
});

async function buildShopColleague(companyId: number) {
  const { User } = await import("../../../server/accounts/model.ts");
  const { hashPassword } = await import("../../../server/accounts/passwords.ts");
  const { TEST_PASSWORD } = await import("../../support/build-company.ts");
  const { agentFor } = await import("../../support/test-app.ts");
  const email = `buyer2-${companyId}-${Date.now()}@example.test`;
  await User.create({
    companyId,
    email,
    name: "Second Buyer",
    role: "buyer",
    passwordHash: await hashPassword(TEST_PASSWORD),
  });
  const agent = agentFor(t.app);
  await agent.post("/api/auth/sign-in").send({ email, password: TEST_PASSWORD }).expect(200);
  return agent;
}
