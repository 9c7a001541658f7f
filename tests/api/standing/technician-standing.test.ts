import { describe, expect, it } from "vitest";
import request from "supertest";
import { useTestApp } from "../../support/test-app.ts";
import { buildCompany } from "../../support/build-company.ts";
import { buildClearedProvider, buildProvider } from "../../fixtures/build-credential-row.ts";
import { runLapseJob } from "../../../jobs/lapse.ts";
import { defaultBaseline } from "../../../shared/standing/requirements.ts";
import { signIn } from "./sign-in-as.ts";

const t = useTestApp();

describe("technician standing", () => {
  it("shows the provider admin each baseline requirement with its status, reason, detail and lapse date", async () => {
    const p = await buildClearedProvider({ glExpires: "2099-07-15", wcExpires: "2099-07-15" });
    const agent = await signIn(t.app, p.admin.email);

    const res = await agent.get(`/api/technicians/${p.technician.id}/standing`);

    expect(res.status).toBe(200);
    expect(res.body.baseline.standing).toBe("cleared");
    expect(res.body.baseline.results).toEqual(
      defaultBaseline.requirements.map((r) =>
        expect.objectContaining({
          requirement: r,
          status: "met",
          reason: null,
          lapsesAt: expect.any(String),
        }),
      ),
    );
  });

  it("names the missing requirement when a company has no workers' compensation", async () => {
    const p = await buildProvider();
    const agent = await signIn(t.app, p.admin.email);

    const res = await agent.get(`/api/technicians/${p.technician.id}/standing`);

    expect(res.body.baseline.standing).toBe("not_cleared");
    expect(res.body.baseline.results[1]).toMatchObject({ status: "unmet", reason: "missing" });
  });

  it("lets the technician, a reviewer and an admin read it", async () => {
    const p = await buildProvider();
    const { users } = await buildCompany("platform", ["reviewer", "admin"]);

    const answers = [
      await (await signIn(t.app, p.technicianUser.email)).get(`/api/technicians/${p.technician.id}/standing`),
      await (await signIn(t.app, users.reviewer!.email)).get(`/api/technicians/${p.technician.id}/standing`),
      await (await signIn(t.app, users.admin!.email)).get(`/api/technicians/${p.technician.id}/standing`),
    ];

    expect(answers.map((r) => r.status)).toEqual([200, 200, 200]);
  });

  it("answers 404 to another company's admin and 403 to a buyer, 401 when signed out", async () => {
    const p = await buildProvider();
    const other = await buildProvider();
    const { users } = await buildCompany("shop", ["buyer"]);

    const foreign = await (
      await signIn(t.app, other.admin.email)
    ).get(`/api/technicians/${p.technician.id}/standing`);
    const buyer = await (
      await signIn(t.app, users.buyer!.email)
    ).get(`/api/technicians/${p.technician.id}/standing`);
    const anonymous = await request(t.app).get(`/api/technicians/${p.technician.id}/standing`);

    expect([foreign.status, buyer.status, anonymous.status]).toEqual([404, 403, 401]);
  });
});

describe("platform baseline", () => {
  it("is readable by any signed-in user and editable by an admin, which recomputes standings", async () => {
    const p = await buildClearedProvider({ glExpires: "2099-07-15", wcExpires: "2099-07-15" });
    const { users } = await buildCompany("platform", ["admin"]);
    const admin = await signIn(t.app, users.admin!.email);
    const office = await signIn(t.app, p.admin.email);
    const stricter = [
      ...defaultBaseline.requirements,
      { id: "baseline_auto", label: "Auto liability in force", typeCodes: ["auto_liability"] },
    ];

    const before = await office.get("/api/baseline");
    // The suite's test files share one database: the platform baseline is put back even when a step fails, or every
    // later file would meet the stricter rule.
    let put, standing, restored;
    try {
      put = await admin.put("/api/admin/baseline").send({ requirements: stricter });
      standing = await office.get(`/api/technicians/${p.technician.id}/standing`);
    } finally {
      restored = await admin.put("/api/admin/baseline").send({ requirements: defaultBaseline.requirements });
    }

    expect(before.status).toBe(200);
    expect(put.status).toBe(200);
    expect(put.body.requirements).toHaveLength(3);
    expect(standing.body.baseline.standing).toBe("not_cleared");
    expect(standing.body.baseline.results[2]).toMatchObject({ status: "unmet", reason: "missing" });
    expect(restored.status).toBe(200);
    // Each baseline change recomputes every standing in the suite's shared database, which grows with the suite.
  }, 120_000);

  it("answers 403 to a non-admin editing it, 422 naming the field, and 401 when signed out", async () => {
    const p = await buildProvider();
    const { users } = await buildCompany("platform", ["admin"]);
    const admin = await signIn(t.app, users.admin!.email);

    const office = await (
      await signIn(t.app, p.admin.email)
    )
      .put("/api/admin/baseline")
      .send({ requirements: defaultBaseline.requirements });
    const invalid = await admin
      .put("/api/admin/baseline")
      .send({ requirements: [{ label: "", typeCodes: ["general_liability"] }] });
    const anonymous = await request(t.app).get("/api/baseline");

    expect(office.status).toBe(403);
    expect(invalid.status).toBe(422);
    expect(invalid.body.error.fields[0].path).toBe("body.requirements.0.label");
    expect(anonymous.status).toBe(401);
  });
});

describe("job runs", () => {
  it("lists the lapse job's runs with their counts to an admin only", async () => {
    const report = await runLapseJob(
      { asOf: new Date("2027-03-01T06:00:00Z") },
      { warningDays: [60, 30, 14, 7, 1], publicUrl: "https://clearbench.test" },
    );
    const { users } = await buildCompany("platform", ["admin", "reviewer"]);

    const res = await (await signIn(t.app, users.admin!.email)).get("/api/admin/job-runs");
    const reviewer = await (await signIn(t.app, users.reviewer!.email)).get("/api/admin/job-runs");

    expect(report.skipped).toBe(false);
    expect(res.status).toBe(200);
    // Other test files record runs of their own jobs in the same database: look for this run by its job and instant.
    const run = (res.body as { job: string; asOf: string }[]).find(
      (r) => r.job === "lapse" && r.asOf === "2027-03-01T06:00:00.000Z",
    );
    expect(run).toMatchObject({
      job: "lapse",
      asOf: "2027-03-01T06:00:00.000Z",
      counts: expect.objectContaining({ lapsed: expect.any(Number) }),
    });
    expect(reviewer.status).toBe(403);
  });
});
