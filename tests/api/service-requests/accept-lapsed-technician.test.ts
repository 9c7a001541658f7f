import { afterEach, describe, expect, it, vi } from "vitest";
import { sequelize, useTestApp } from "../../support/test-app.ts";
import {
  buildClearedCompany,
  buildShop,
  estimateBody,
  onlyInvite,
  raiseRequest,
} from "../../fixtures/build-service-request-world.ts";
import { addCalendarDays } from "../../../shared/standing/iso-date.ts";
import { policyEndInstant } from "../../../shared/standing/policy-period.ts";

const t = useTestApp();
afterEach(() => {
  vi.useRealTimers();
});

// Yesterday's UTC date: its 12:01 a.m. standard-time cut-off in Chicago is always in the past, so the sessions signed in
// now stay valid while the clock is set to it.
const yesterday = () => addCalendarDays(new Date().toISOString().slice(0, 10), -1);

async function at<T>(instant: Date, act: () => Promise<T>): Promise<T> {
  vi.useFakeTimers({ toFake: ["Date"], now: instant });
  try {
    return await act();
  } finally {
    vi.useRealTimers();
  }
}

async function estimateBeforeLapse() {
  const expirationDate = yesterday();
  // The policy ends at 12:01 a.m. standard time at the insured's address on its expiration date (common practice in US
  // commercial policies; from memory).
  const lapse = policyEndInstant(expirationDate, "America/Chicago");
  const shop = await buildShop(t.app);
  const company = await buildClearedCompany(t.app, { generalLiabilityExpires: expirationDate });
  // The stored standing still says cleared, as it would until the daily job runs.
  await sequelize().query(
    "UPDATE technician_standings SET standing = 'cleared', earliest_lapse = NULL WHERE technician_id = $1",
    {
      bind: [company.technician.id],
    },
  );
  const request = await at(new Date(lapse.getTime() - 60_000), async () =>
    raiseRequest(shop, await onlyInvite(shop, [company.company.id])),
  );
  const sent = await at(new Date(lapse.getTime() - 30_000), () =>
    company.admin
      .post(`/api/service-requests/${request.id}/estimates`)
      .send(estimateBody(company, { validUntil: addCalendarDays(expirationDate, 14) })),
  );
  if (sent.status !== 201) throw new Error(`estimate failed: ${sent.status} ${JSON.stringify(sent.body)}`);
  return { shop, company, request, estimateId: sent.body.estimates[0].id as number, lapse };
}

describe("accepting an estimate at the moment the technician lapses", () => {
  it("answers 409 naming the unmet requirement when the policy lapsed one second ago", async () => {
    const { shop, request, estimateId, lapse } = await estimateBeforeLapse();

    const res = await at(new Date(lapse.getTime() + 1000), () =>
      shop.agent.post(`/api/service-requests/${request.id}/estimates/${estimateId}/accept`),
    );

    expect(res.status).toBe(409);
    const general = res.body.error.fields.find((f: { message: string }) =>
      f.message.includes("General liability"),
    );
    expect(general.message).toContain("lapsed");
  });

  it("accepts the same estimate one second before the lapse", async () => {
    const { shop, request, estimateId, lapse } = await estimateBeforeLapse();

    const res = await at(new Date(lapse.getTime() - 1000), () =>
      shop.agent.post(`/api/service-requests/${request.id}/estimates/${estimateId}/accept`),
    );

    expect(res.status).toBe(200);
    expect(res.body.status).toBe("decided");
  });
});

describe("accepting an estimate past its validity", () => {
  it("answers 409 when the estimate's valid-until date has passed at the site", async () => {
    const shop = await buildShop(t.app);
    const company = await buildClearedCompany(t.app);
    const threeDaysAgo = new Date(Date.now() - 3 * 86_400_000);
    const request = await raiseRequest(shop, await onlyInvite(shop, [company.company.id]));
    const sent = await at(threeDaysAgo, () =>
      company.admin.post(`/api/service-requests/${request.id}/estimates`).send(
        estimateBody(company, {
          validUntil: addCalendarDays(threeDaysAgo.toISOString().slice(0, 10), 1),
          earliestArrival: `${addCalendarDays(threeDaysAgo.toISOString().slice(0, 10), 1)}T09:30`,
        }),
      ),
    );

    const res = await shop.agent.post(
      `/api/service-requests/${request.id}/estimates/${sent.body.estimates[0].id}/accept`,
    );

    expect(sent.status).toBe(201);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toContain("valid until");
  });
});
