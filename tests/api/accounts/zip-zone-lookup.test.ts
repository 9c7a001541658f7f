import request from "supertest";
import { describe, expect, it } from "vitest";
import { useTestApp } from "../../support/test-app.ts";

// The policy period runs on standard time at the named insured's mailing address (ISO CG DS 01 wording, from memory),
// so the sign-up form shows the zone the ZIP gives before the account is made.
const t = useTestApp();

describe("the public ZIP look-up the sign-up form uses", () => {
  it("answers the city, state and zone a new company with this ZIP would get, signed out", async () => {
    const phoenix = await request(t.app).get("/api/geo/zip/85004");
    const manhattan = await request(t.app).get("/api/geo/zip/10001");

    expect(phoenix.status).toBe(200);
    expect(phoenix.body).toMatchObject({ postalCode: "85004", state: "AZ", timeZone: "America/Phoenix" });
    expect(phoenix.body.city).toEqual(expect.any(String));
    expect(manhattan.body).toMatchObject({ state: "NY", timeZone: "America/New_York" });
  });

  it("names the field and the reason for a malformed or unknown ZIP", async () => {
    const malformed = await request(t.app).get("/api/geo/zip/85a04");
    const unknown = await request(t.app).get("/api/geo/zip/00000");

    expect(malformed.status).toBe(400);
    expect(malformed.body.error.fields[0].path).toBe("params.zip");
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.fields).toEqual([{ path: "params.zip", message: "not a known US ZIP code" }]);
  });

  it("is limited per address, so the ZIP table cannot be copied through it", async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 32; i += 1) statuses.push((await request(t.app).get("/api/geo/zip/60601")).status);

    expect(statuses.filter((s) => s === 429).length).toBeGreaterThanOrEqual(1);
  });
});
