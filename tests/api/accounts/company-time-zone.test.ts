import { randomUUID } from "node:crypto";
import { describe, expect, it } from "vitest";
import { Company } from "../../../server/companies/model.ts";
import { Credential } from "../../../server/credentials/model.ts";
import { agentFor, useTestApp } from "../../support/test-app.ts";
import { buildProvider } from "../../support/build-provider.ts";
import { buildCredentialRow, insuranceFields } from "../../fixtures/build-credential-row.ts";

// The policy period runs on standard time at the named insured's mailing address (the standard CGL declarations,
// ISO CG DS 01: "12:01 A.M. standard time at your mailing address", wording from memory), so the company's zone follows its ZIP code.
const t = useTestApp();

const form = (postalCode: string) => ({
  kind: "service",
  companyName: `Larchmont Arbor Service ${randomUUID().slice(0, 6)}`,
  addressLine: "4 Quarry Row",
  postalCode,
  name: "Ines Waldgrave",
  email: `office-${randomUUID().slice(0, 8)}@example.test`,
  password: "a long enough password",
});

describe("a company's time zone follows its ZIP code", () => {
  it("derives the zone at sign-up: 85004 (Phoenix) is America/Phoenix, 10001 (Manhattan) is America/New_York", async () => {
    const phoenix = agentFor(t.app);
    await phoenix.post("/api/auth/sign-up").send(form("85004")).expect(201);
    const newYork = agentFor(t.app);
    await newYork.post("/api/auth/sign-up").send(form("10001")).expect(201);

    const a = await phoenix.get("/api/company").expect(200);
    const b = await newYork.get("/api/company").expect(200);

    expect(a.body).toMatchObject({ postalCode: "85004", state: "AZ", timeZone: "America/Phoenix" });
    expect(b.body).toMatchObject({ postalCode: "10001", state: "NY", timeZone: "America/New_York" });
  });

  it("refuses an unknown ZIP code at sign-up and saves nothing", async () => {
    const body = form("00000");

    const res = await agentFor(t.app).post("/api/auth/sign-up").send(body);

    expect(res.status).toBe(422);
    expect(res.body.error.fields).toEqual([{ path: "body.postalCode", message: "not a known US ZIP code" }]);
    expect(await Company.count({ where: { name: body.companyName } })).toBe(0);
  });

  it("refuses a zone sent on its own, leaving the zone as it was", async () => {
    const { admin, company } = await buildProvider(t.app);

    const alone = await admin.put("/api/company/address").send({ timeZone: "America/Denver" });
    const withAddress = await admin
      .put("/api/company/address")
      .send({ addressLine: "9 Kiln St", postalCode: "60601", timeZone: "America/Denver" });

    expect(alone.status).toBe(422);
    expect(alone.body.error.fields.map((f: { path: string }) => f.path)).toEqual(
      expect.arrayContaining(["body.addressLine", "body.postalCode", "body.timeZone"]),
    );
    expect(withAddress.status).toBe(422);
    expect(withAddress.body.error.fields).toEqual([
      {
        path: "body.timeZone",
        message: "The time zone follows the ZIP code; change the mailing address instead",
      },
    ]);
    await company.reload();
    expect(company.timeZone).toBe("America/Chicago");
  });

  it("moves the zone with the address and reads stored policy lapses in the new zone", async () => {
    const { admin, company, adminUser } = await buildProvider(t.app);
    const policy = await buildCredentialRow({
      companyId: company.id,
      submittedBy: adminUser.id,
      typeCode: "general_liability",
      fields: insuranceFields({ effectiveDate: "2026-07-15", expirationDate: "2027-07-15" }),
    });
    // 12:01 a.m. Central Standard Time (UTC-6) while the company is in Chicago.
    expect(policy.lapsesAt?.toISOString()).toBe("2027-07-15T06:01:00.000Z");

    const res = await admin
      .put("/api/company/address")
      .send({ addressLine: "200 Ridge Rd", postalCode: "80202" });

    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ postalCode: "80202", state: "CO", timeZone: "America/Denver" });
    await policy.reload();
    // 12:01 a.m. Mountain Standard Time (UTC-7) on 2027-07-15, even in July.
    expect(policy.lapsesAt?.toISOString()).toBe("2027-07-15T07:01:00.000Z");
    const stored = await Credential.findByPk(policy.id);
    expect(stored?.lapsesAt?.toISOString()).toBe("2027-07-15T07:01:00.000Z");
  });

  it("lets a technician neither read nor move the company", async () => {
    const { tech } = await buildProvider(t.app);

    const read = await tech.get("/api/company");
    const move = await tech.put("/api/company/address").send({ addressLine: "1 A St", postalCode: "80202" });

    expect(read.status).toBe(403);
    expect(move.status).toBe(403);
  });
});
