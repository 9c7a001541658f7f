import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes, Sequelize } from "sequelize";
import { buildTestApp, sequelize, type TestApp } from "../../support/test-app.ts";
import { buildProvider, signedInAgent } from "../../support/build-provider.ts";
import { buildWorkOrderWorld, workOrderAt } from "../../fixtures/build-work-order-world.ts";
import { AuditEvent } from "../../../server/audit/model.ts";
import { JobReview } from "../../../server/reviews/model.ts";
import { JOB_LOCK_KEYS } from "../../../jobs/advisory-lock.ts";

let t: TestApp;
let admin: Awaited<ReturnType<typeof signedInAgent>>;
beforeAll(async () => {
  t = buildTestApp();
  admin = await signedInAgent(t.app, "platform", "admin");
});
afterAll(() => t.close());

const audits = (action: string, subjectId: number) =>
  AuditEvent.count({ where: { action, subjectId, actorUserId: admin.user.id } });

describe("deactivating a user", () => {
  it("ends the user's sessions at once: their existing cookie gets 401 on the next request", async () => {
    const provider = await buildProvider(t.app);
    const before = await provider.tech.get("/api/auth/me");

    const res = await admin.agent.post(`/api/admin/users/${provider.techUser.id}/deactivate`);
    const after = await provider.tech.get("/api/auth/me");
    const signIn = await provider.tech
      .post("/api/auth/sign-in")
      .send({ email: provider.techUser.email, password: "correct horse battery" });
    const listed = await admin.agent.get("/api/admin/users");

    expect(before.status).toBe(200);
    expect(res.status).toBe(200);
    expect(res.body.status).toBe("deactivated");
    expect(after.status).toBe(401);
    expect(signIn.status).toBe(401);
    expect(listed.body.find((u: { id: number }) => u.id === provider.techUser.id).status).toBe("deactivated");
    expect(await audits("user.deactivated", provider.techUser.id)).toBe(1);
  });

  it("reactivates a user, who may sign in again; a second deactivation of the same state is 409", async () => {
    const provider = await buildProvider(t.app);
    await admin.agent.post(`/api/admin/users/${provider.adminUser.id}/deactivate`).expect(200);

    const again = await admin.agent.post(`/api/admin/users/${provider.adminUser.id}/deactivate`);
    const back = await admin.agent.post(`/api/admin/users/${provider.adminUser.id}/reactivate`);
    const signIn = await provider.admin
      .post("/api/auth/sign-in")
      .send({ email: provider.adminUser.email, password: "correct horse battery" });

    expect(again.status).toBe(409);
    expect(back.status).toBe(200);
    expect(back.body.status).toBe("active");
    expect(signIn.status).toBe(200);
    expect(await audits("user.reactivated", provider.adminUser.id)).toBe(1);
  });

  it("lists an invited user who has not chosen a password as invited", async () => {
    const shop = await signedInAgent(t.app, "shop", "buyer");
    const invited = await admin.agent.post("/api/admin/invitations").send({
      email: `new-buyer-${shop.company.id}@example.test`,
      name: "Orla Penhallow",
      role: "buyer",
      companyId: shop.company.id,
    });

    const listed = await admin.agent.get("/api/admin/users");

    expect(invited.status).toBe(201);
    const row = listed.body.find(
      (u: { email: string }) => u.email === `new-buyer-${shop.company.id}@example.test`,
    );
    expect(row.status).toBe("invited");
    expect(listed.body.find((u: { id: number }) => u.id === shop.user.id).status).toBe("active");
  });

  it("refuses to let an admin deactivate their own account", async () => {
    const res = await admin.agent.post(`/api/admin/users/${admin.user.id}/deactivate`);

    expect(res.status).toBe(409);
    expect((await admin.agent.get("/api/auth/me")).status).toBe(200);
  });

  it("answers 403 to every other role and 404 to a missing user", async () => {
    const provider = await buildProvider(t.app);
    const reviewer = await signedInAgent(t.app, "platform", "reviewer");
    const buyer = await signedInAgent(t.app, "shop", "buyer");

    const byProvider = await provider.admin.post(`/api/admin/users/${provider.techUser.id}/deactivate`);
    const byReviewer = await reviewer.agent.post(`/api/admin/users/${provider.techUser.id}/deactivate`);
    const byBuyer = await buyer.agent.post(`/api/admin/users/${buyer.user.id}/reactivate`);
    const missing = await admin.agent.post("/api/admin/users/99999999/deactivate");

    expect([byProvider.status, byReviewer.status, byBuyer.status]).toEqual([403, 403, 403]);
    expect(missing.status).toBe(404);
    expect((await provider.tech.get("/api/auth/me")).status).toBe(200);
  });
});

describe("the companies list", () => {
  it("counts each company's users, technicians and sites", async () => {
    const provider = await buildProvider(t.app);
    const buyer = await signedInAgent(t.app, "shop", "buyer");

    const res = await admin.agent.get("/api/admin/companies");
    const byBuyer = await buyer.agent.get("/api/admin/companies");

    expect(res.status).toBe(200);
    expect(res.body.find((c: { id: number }) => c.id === provider.company.id)).toMatchObject({
      kind: "service",
      users: 2,
      technicians: 1,
      sites: 0,
    });
    expect(res.body.find((c: { id: number }) => c.id === buyer.company.id)).toMatchObject({
      kind: "shop",
      users: 1,
      technicians: 0,
    });
    expect(byBuyer.status).toBe(403);
  });
});

describe("running the daily job now", () => {
  it("runs as of now, records the run as the admin's and audits it", async () => {
    const asked = Date.now();

    const res = await admin.agent.post("/api/admin/job-runs/lapse");
    const runs = await admin.agent.get("/api/admin/job-runs");

    expect(res.status).toBe(201);
    expect(Math.abs(new Date(res.body.asOf).getTime() - asked)).toBeLessThan(60_000);
    const run = runs.body.find((r: { id: number }) => r.id === res.body.jobRunId);
    expect(run).toMatchObject({ job: "lapse", startedBy: { id: admin.user.id } });
    expect(run.finishedAt).not.toBeNull();
    expect(await audits("job.run_manually", res.body.jobRunId)).toBe(1);
  });

  it("answers 409 while a run holds the job's advisory lock, and records nothing", async () => {
    const holder = new Sequelize(t.config.DATABASE_URL!, { dialect: "postgres", logging: false });
    let release!: () => void;
    const released = new Promise<void>((resolve) => (release = resolve));
    let locked!: () => void;
    const lockTaken = new Promise<void>((resolve) => (locked = resolve));
    const holding = holder.transaction(async (transaction) => {
      await holder.query("SELECT pg_advisory_xact_lock($1)", { bind: [JOB_LOCK_KEYS.lapse], transaction });
      locked();
      await released;
    });
    await lockTaken;
    const manualRuns = async () =>
      (
        await sequelize().query<{ n: number }>(
          "SELECT count(*)::int AS n FROM job_runs WHERE started_by = $1",
          { bind: [admin.user.id], type: QueryTypes.SELECT },
        )
      )[0]!.n;
    const runsBefore = await manualRuns();

    const res = await admin.agent.post("/api/admin/job-runs/lapse");
    release();
    await holding;
    await holder.close();

    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/running already/);
    expect(await manualRuns()).toBe(runsBefore);
  });

  it("answers 403 to every other role", async () => {
    const provider = await buildProvider(t.app);
    const reviewer = await signedInAgent(t.app, "platform", "reviewer");

    const res = await Promise.all([
      provider.admin.post("/api/admin/job-runs/lapse"),
      provider.tech.post("/api/admin/job-runs/lapse"),
      reviewer.agent.post("/api/admin/job-runs/lapse"),
    ]);

    expect(res.map((r) => r.status)).toEqual([403, 403, 403]);
  });
});

describe("reported reviews", () => {
  async function reportedReview() {
    const world = await buildWorkOrderWorld(t.app);
    const id = await workOrderAt(world, "confirmed");
    const review = await world.shop.agent
      .post(`/api/work-orders/${id}/review`)
      .send({ stars: 2, body: "Left the coolant line loose." });
    await world.provider.admin
      .post(`/api/reviews/${review.body.id}/report`)
      .send({ reason: "The job was finished as agreed; see the thread." })
      .expect(200);
    return { world, reviewId: review.body.id as number };
  }

  it("keeps a reported review counted, once, and audits it", async () => {
    const { world, reviewId } = await reportedReview();

    const res = await admin.agent.post(`/api/admin/reviews/${reviewId}/keep`);
    const again = await admin.agent.post(`/api/admin/reviews/${reviewId}/keep`);
    const exclude = await admin.agent
      .post(`/api/admin/reviews/${reviewId}/exclude`)
      .send({ reason: "Changed my mind after keeping it" });
    const listed = await world.shop.agent.get(`/api/technicians/${world.provider.technician.id}/reviews`);

    expect(res.status).toBe(200);
    expect(res.body.kept).toMatchObject({ by: admin.user.name });
    expect(again.status).toBe(409);
    expect(exclude.status).toBe(200);
    expect(exclude.body.kept).toBeNull();
    expect(listed.body.count).toBe(0);
    expect(await audits("review.kept", reviewId)).toBe(1);
  });

  it("leaves a reported review out of the score with a reason; the review stays on file", async () => {
    const { world, reviewId } = await reportedReview();
    const before = await world.shop.agent.get(`/api/technicians/${world.provider.technician.id}/reviews`);

    const res = await admin.agent
      .post(`/api/admin/reviews/${reviewId}/exclude`)
      .send({ reason: "The rated job was a warranty call the shop disputed elsewhere" });
    const after = await world.shop.agent.get(`/api/technicians/${world.provider.technician.id}/reviews`);
    const keep = await admin.agent.post(`/api/admin/reviews/${reviewId}/keep`);

    expect(before.body.count).toBe(1);
    expect(res.status).toBe(200);
    expect(after.body.count).toBe(0);
    expect(keep.status).toBe(409);
    expect(await JobReview.count({ where: { id: reviewId } })).toBe(1);
    expect(await audits("review.excluded_from_score", reviewId)).toBe(1);
  });

  it("answers 403 to a reviewer or a party to the job, and 404 to a missing review", async () => {
    const { world, reviewId } = await reportedReview();
    const reviewer = await signedInAgent(t.app, "platform", "reviewer");

    const byReviewer = await reviewer.agent.post(`/api/admin/reviews/${reviewId}/keep`);
    const byShop = await world.shop.agent.post(`/api/admin/reviews/${reviewId}/keep`);
    const missing = await admin.agent.post("/api/admin/reviews/99999999/keep");

    expect([byReviewer.status, byShop.status]).toEqual([403, 403]);
    expect(missing.status).toBe(404);
    expect((await JobReview.findByPk(reviewId))!.keptAt).toBeNull();
  });
});
