import { describe, expect, it } from "vitest";
import request from "supertest";
import { QueryTypes } from "sequelize";
import { sequelize, useTestApp } from "../../support/test-app.ts";
import { signedInAgent } from "../../support/build-provider.ts";
import { buildWorkOrderWorld, workOrderAt } from "../../fixtures/build-work-order-world.ts";
import { JobReview } from "../../../server/reviews/model.ts";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../../shared/api/error-body.ts";

const t = useTestApp();

const REVIEW = { stars: 4, body: "Found the worn drawbar spring within the hour; tidy work." };

async function ratingOf(technicianId: number) {
  const rows = await sequelize().query<{ review_count: number; star_sum: number }>(
    "SELECT review_count, star_sum FROM technician_ratings WHERE technician_id = $1",
    { bind: [technicianId], type: QueryTypes.SELECT },
  );
  return rows[0] ?? null;
}

describe("who may rate a job", () => {
  it("lets a buyer of the shop rate a confirmed work order, and adds it to the technician's rating in the same step", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "confirmed");

    const res = await world.shop.agent.post(`/api/work-orders/${id}/review`).send(REVIEW);

    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      workOrderId: id,
      technicianId: world.provider.technician.id,
      stars: 4,
      reply: null,
      reported: false,
    });
    expect(await ratingOf(world.provider.technician.id)).toEqual({ review_count: 1, star_sum: 4 });
  });

  it.each(["requested", "accepted", "completed", "declined"] as const)(
    "refuses with 403 to rate a %s work order",
    async (status) => {
      const world = await buildWorkOrderWorld(t.app);
      const id = await workOrderAt(world, status);

      const res = await world.shop.agent.post(`/api/work-orders/${id}/review`).send(REVIEW);

      expect(res.status).toBe(403);
      expect(await JobReview.count({ where: { workOrderId: id } })).toBe(0);
      expect(await ratingOf(world.provider.technician.id)).toBeNull();
    },
  );

  it("answers 404 to a buyer of another shop, as for a missing work order", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "confirmed");
    const otherShop = await signedInAgent(t.app, "shop", "buyer");

    const res = await otherShop.agent.post(`/api/work-orders/${id}/review`).send(REVIEW);

    expect(res.status).toBe(404);
    expect(await JobReview.count({ where: { workOrderId: id } })).toBe(0);
  });

  it("answers 403 to the service company rating its own job, and 401 when signed out", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "confirmed");

    const byProvider = await world.provider.admin.post(`/api/work-orders/${id}/review`).send(REVIEW);
    const byTechnician = await world.provider.tech.post(`/api/work-orders/${id}/review`).send(REVIEW);
    const anonymous = await request(t.app)
      .post(`/api/work-orders/${id}/review`)
      .set(CSRF_HEADER, CSRF_HEADER_VALUE)
      .send(REVIEW);

    expect(byProvider.status).toBe(403);
    expect(byTechnician.status).toBe(403);
    expect(anonymous.status).toBe(401);
  });

  it("answers 409 to a second review and leaves the rating counted once", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "confirmed");
    await world.shop.agent.post(`/api/work-orders/${id}/review`).send(REVIEW).expect(201);

    const second = await world.shop.agent
      .post(`/api/work-orders/${id}/review`)
      .send({ stars: 1, body: "Changed my mind about this one." });

    expect(second.status).toBe(409);
    expect(await ratingOf(world.provider.technician.id)).toEqual({ review_count: 1, star_sum: 4 });
  });

  it("takes the technician and the author from the work order, whatever the client sends", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const other = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "confirmed");

    const res = await world.shop.agent.post(`/api/work-orders/${id}/review`).send({
      ...REVIEW,
      technicianId: other.provider.technician.id,
      authorUserId: other.shop.user.id,
      shopCompanyId: other.shop.company.id,
    });

    expect(res.status).toBe(201);
    const row = await JobReview.findByPk(res.body.id);
    expect(row).toMatchObject({
      technicianId: world.provider.technician.id,
      authorUserId: world.shop.user.id,
      shopCompanyId: world.shop.company.id,
    });
  });

  it("answers 422 naming the field for stars outside 1 to 5", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "confirmed");

    const res = await world.shop.agent.post(`/api/work-orders/${id}/review`).send({ ...REVIEW, stars: 6 });

    expect(res.status).toBe(422);
    expect(res.body.error.fields[0].path).toBe("body.stars");
  });
});

describe("answering a review", () => {
  async function reviewed() {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "confirmed");
    const review = await world.shop.agent.post(`/api/work-orders/${id}/review`).send(REVIEW);
    return { world, reviewId: review.body.id as number };
  }

  it("lets the technician's company reply once; a second reply is 409", async () => {
    const { world, reviewId } = await reviewed();

    const first = await world.provider.admin
      .post(`/api/reviews/${reviewId}/reply`)
      .send({ body: "Thank you, glad the line is running again." });
    const second = await world.provider.admin
      .post(`/api/reviews/${reviewId}/reply`)
      .send({ body: "One more thing..." });

    expect(first.status).toBe(200);
    expect(first.body.reply).toBe("Thank you, glad the line is running again.");
    expect(second.status).toBe(409);
    expect((await JobReview.findByPk(reviewId))!.reply).toBe("Thank you, glad the line is running again.");
  });

  it("refuses a reply from the technician (403), another company (404) and the shop (403)", async () => {
    const { world, reviewId } = await reviewed();
    const other = await buildWorkOrderWorld(t.app);

    const byTechnician = await world.provider.tech
      .post(`/api/reviews/${reviewId}/reply`)
      .send({ body: "Thanks!" });
    const byOtherCompany = await other.provider.admin
      .post(`/api/reviews/${reviewId}/reply`)
      .send({ body: "Thanks!" });
    const byShop = await world.shop.agent.post(`/api/reviews/${reviewId}/reply`).send({ body: "Thanks!" });

    expect([byTechnician.status, byOtherCompany.status, byShop.status]).toEqual([403, 404, 403]);
  });

  it("flags a reported review for the admin, keeps it listed, and refuses outsiders", async () => {
    const { world, reviewId } = await reviewed();
    const outsider = await signedInAgent(t.app, "shop", "buyer");
    const admin = await signedInAgent(t.app, "platform", "admin");

    const byOutsider = await outsider.agent
      .post(`/api/reviews/${reviewId}/report`)
      .send({ reason: "Not our job at all" });
    const report = await world.provider.tech
      .post(`/api/reviews/${reviewId}/report`)
      .send({ reason: "Names the wrong machine" });
    const queue = await admin.agent.get("/api/admin/reviews/reported");
    const byBuyer = await world.shop.agent.get("/api/admin/reviews/reported");
    const stillListed = await outsider.agent.get(`/api/technicians/${world.provider.technician.id}/reviews`);

    expect(byOutsider.status).toBe(404);
    expect(report.status).toBe(200);
    expect(report.body.reported).toBe(true);
    const flagged = queue.body.find((r: { id: number }) => r.id === reviewId);
    expect(flagged).toMatchObject({
      reportReason: "Names the wrong machine",
      reportedBy: { id: world.provider.techUser.id },
    });
    expect(byBuyer.status).toBe(403);
    expect(stillListed.body.items.map((r: { id: number }) => r.id)).toContain(reviewId);
  });

  it("refuses to delete a review or change its stars, even from the database", async () => {
    const { reviewId } = await reviewed();

    const remove = () => sequelize().query("DELETE FROM job_reviews WHERE id = $1", { bind: [reviewId] });
    const rewrite = () =>
      sequelize().query("UPDATE job_reviews SET stars = 5 WHERE id = $1", { bind: [reviewId] });

    await expect(remove()).rejects.toThrow(/never deleted/);
    await expect(rewrite()).rejects.toThrow(/cannot be changed/);
    expect((await JobReview.findByPk(reviewId))!.stars).toBe(REVIEW.stars);
  });
});

describe("a technician's reviews", () => {
  it("shows the average with its count and the reviews, newest first", async () => {
    const world = await buildWorkOrderWorld(t.app);
    const first = await workOrderAt(world, "confirmed");
    const second = await workOrderAt(world, "confirmed");
    const older = await world.shop.agent
      .post(`/api/work-orders/${first}/review`)
      .send({ stars: 5, body: "Excellent, fast and careful." })
      .expect(201);
    const newer = await world.shop.agent
      .post(`/api/work-orders/${second}/review`)
      .send({ stars: 2, body: "Late, and left swarf everywhere." })
      .expect(201);

    const res = await world.shop.agent.get(`/api/technicians/${world.provider.technician.id}/reviews`);

    expect(res.status).toBe(200);
    expect(res.body.count).toBe(2);
    expect(res.body.average).toBe(3.5);
    expect(res.body.items.map((r: { id: number }) => r.id)).toEqual([newer.body.id, older.body.id]);
    expect(await ratingOf(world.provider.technician.id)).toEqual({ review_count: 2, star_sum: 7 });
  });

  it("answers 404 for an unknown technician and 401 when signed out", async () => {
    const world = await buildWorkOrderWorld(t.app);

    const missing = await world.shop.agent.get("/api/technicians/2147483000/reviews");
    const anonymous = await request(t.app).get(`/api/technicians/${world.provider.technician.id}/reviews`);

    expect(missing.status).toBe(404);
    expect(anonymous.status).toBe(401);
  });
});
