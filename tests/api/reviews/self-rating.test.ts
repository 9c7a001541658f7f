import { describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { sequelize, useTestApp } from "../../support/test-app.ts";
import { signedInAgent } from "../../support/build-provider.ts";
import {
  buildWorkOrderWorld,
  workOrderAt,
  type WorkOrderWorld,
} from "../../fixtures/build-work-order-world.ts";
import { JobReview } from "../../../server/reviews/model.ts";
import { User } from "../../../server/accounts/model.ts";
import { Company } from "../../../server/companies/model.ts";
import { AuditEvent } from "../../../server/audit/model.ts";

const t = useTestApp();

/** Gives the shop contacts of its own (the test builders share one mail domain and one street for every company). */
async function keepApart(world: WorkOrderWorld, shopDomain: string) {
  await User.update(
    { email: sequelize().literal(`split_part(email, '@', 1) || '@${shopDomain}'`) as never },
    { where: { companyId: world.shop.company.id } },
  );
  await Company.update(
    { addressLine: "88 Quillon Avenue", postalCode: "46204" },
    { where: { id: world.shop.company.id } },
  );
  const domain = `svc-${world.provider.company.id}.test`;
  await User.update(
    { email: sequelize().literal(`split_part(email, '@', 1) || '@${domain}'`) as never },
    { where: { companyId: world.provider.company.id } },
  );
  return domain;
}

async function rate(world: WorkOrderWorld, stars = 5) {
  const id = await workOrderAt(world, "confirmed");
  const res = await world.shop.agent
    .post(`/api/work-orders/${id}/review`)
    .send({ stars, body: "Spotless spindle rebuild." });
  expect(res.status).toBe(201);
  return res.body.id as number;
}

async function ratingOf(technicianId: number) {
  const [row] = await sequelize().query<{ review_count: number; star_sum: number; ranking_score: number }>(
    "SELECT review_count, star_sum, ranking_score FROM technician_ratings WHERE technician_id = $1",
    { bind: [technicianId], type: QueryTypes.SELECT },
  );
  return row;
}

describe("reviews that may be a company rating itself", () => {
  it("flags a review when the shop signs in from the service company's mail domain, and lists it for the admin", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const serviceDomain = await keepApart(world, `shop-${world.shop.company.id}.test`);
    await User.update({ email: `purchasing@${serviceDomain}` }, { where: { id: world.shop.user.id } });
    const admin = await signedInAgent(t.app, "platform", "admin");

    const reviewId = await rate(world);
    const queue = await admin.agent.get("/api/admin/reviews/reported");

    expect((await JobReview.findByPk(reviewId))!.selfRatingSignals).toEqual(["email_domain"]);
    expect(queue.body.find((r: { id: number }) => r.id === reviewId)).toMatchObject({
      selfRatingSignals: ["email_domain"],
      reportedAt: null,
      excluded: null,
    });
  });

  it("flags a shared street address, and not a shared public mailbox provider", async () => {
    const world = await buildWorkOrderWorld(t.app);
    await keepApart(world, "gmail.com");
    await User.update(
      { email: `owner-${world.provider.company.id}@gmail.com` },
      { where: { id: world.provider.adminUser.id } },
    );
    const apart = await rate(world);
    await Company.update(
      { addressLine: "1 test lane.", postalCode: "60601-1234" },
      { where: { id: world.shop.company.id } },
    );

    const together = await rate(world);

    expect((await JobReview.findByPk(apart))!.selfRatingSignals).toEqual([]);
    expect((await JobReview.findByPk(together))!.selfRatingSignals).toEqual(["address"]);
  });
});

describe("leaving a flagged review out of the score", () => {
  it("keeps the review, takes its stars out of the totals and the ranking score, and audits it", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const serviceDomain = await keepApart(world, `shop-${world.shop.company.id}.test`);
    const honest = await rate(world, 3);
    await User.update({ email: `purchasing@${serviceDomain}` }, { where: { id: world.shop.user.id } });
    const flagged = await rate(world, 5);
    const admin = await signedInAgent(t.app, "platform", "admin");
    const before = await ratingOf(world.provider.technician.id);

    const res = await admin.agent
      .post(`/api/admin/reviews/${flagged}/exclude`)
      .send({ reason: "Shop and service company share a mail domain" });
    const after = await ratingOf(world.provider.technician.id);
    const again = await admin.agent
      .post(`/api/admin/reviews/${flagged}/exclude`)
      .send({ reason: "Once more, please" });
    const unflagged = await admin.agent
      .post(`/api/admin/reviews/${honest}/exclude`)
      .send({ reason: "Not flagged at all" });
    const listed = await world.shop.agent.get(`/api/technicians/${world.provider.technician.id}/reviews`);

    expect(res.status).toBe(200);
    expect(res.body.excluded).toMatchObject({ reason: "Shop and service company share a mail domain" });
    expect(before).toMatchObject({ review_count: 2, star_sum: 8 });
    expect(after).toMatchObject({ review_count: 1, star_sum: 3 });
    expect(after!.ranking_score).toBeLessThan(before!.ranking_score);
    expect(again.status).toBe(409);
    expect(unflagged.status).toBe(409);
    expect(await JobReview.count({ where: { id: [honest, flagged] } })).toBe(2);
    expect(listed.body).toMatchObject({ count: 1, average: 3 });
    expect(
      await AuditEvent.count({
        where: { action: "review.excluded_from_score", subjectId: flagged, actorUserId: admin.user.id },
      }),
    ).toBe(1);
  });

  it("answers 422 naming body.reason without a reason, and 403 to anyone but an admin", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const reviewId = await rate(world);
    const admin = await signedInAgent(t.app, "platform", "admin");
    const reviewer = await signedInAgent(t.app, "platform", "reviewer");

    const noReason = await admin.agent.post(`/api/admin/reviews/${reviewId}/exclude`).send({ reason: " " });
    const byReviewer = await reviewer.agent
      .post(`/api/admin/reviews/${reviewId}/exclude`)
      .send({ reason: "Looks staged to me" });
    const byProvider = await world.provider.admin
      .post(`/api/admin/reviews/${reviewId}/exclude`)
      .send({ reason: "Looks staged to me" });

    expect(noReason.status).toBe(422);
    expect(noReason.body.error.fields[0].path).toBe("body.reason");
    expect([byReviewer.status, byProvider.status]).toEqual([403, 403]);
    expect((await JobReview.findByPk(reviewId))!.excludedAt).toBeNull();
  });
});
