import { describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { agentFor, useTestApp } from "../../support/test-app.ts";

const t = useTestApp();

const form = (kind: "service" | "shop") => ({
  kind,
  companyName: `Quillfeather ${kind} ${randomUUID().slice(0, 6)}`,
  addressLine: "12 Gantry Lane",
  postalCode: "60601",
  name: "Noor Abernathy-Reyes",
  email: `owner-${randomUUID().slice(0, 8)}@example.test`,
  password: "a long enough password",
});

describe("company sign-up", () => {
  it("creates a service company with its provider_admin, signed in", async () => {
    const agent = agentFor(t.app);

    const res = await agent.post("/api/auth/sign-up").send(form("service"));
    const me = await agent.get("/api/auth/me");

    expect(res.status).toBe(201);
    expect(me.body).toMatchObject({ role: "provider_admin", companyKind: "service" });
  });

  it("creates a machine shop with its first buyer", async () => {
    const res = await agentFor(t.app).post("/api/auth/sign-up").send(form("shop"));

    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ role: "buyer", companyKind: "shop" });
  });

  it("refuses a chosen time zone and a short password, naming both fields", async () => {
    const res = await agentFor(t.app)
      .post("/api/auth/sign-up")
      .send({ ...form("shop"), timeZone: "America/Chicago", password: "short" });

    expect(res.status).toBe(422);
    const paths = res.body.error.fields.map((f: { path: string }) => f.path);
    expect(paths).toEqual(expect.arrayContaining(["body.timeZone", "body.password"]));
  });

  it("refuses a second account with the same e-mail with 409", async () => {
    const first = form("service");
    await agentFor(t.app).post("/api/auth/sign-up").send(first).expect(201);

    const again = await agentFor(t.app)
      .post("/api/auth/sign-up")
      .send({ ...form("service"), email: first.email });

    expect(again.status).toBe(409);
  });
});
