import { describe, expect, it } from "vitest";
import request from "supertest";
import { agentFor, useTestApp } from "../../support/test-app.ts";
import { buildCompany, TEST_PASSWORD } from "../../support/build-company.ts";
import type { Role } from "../../../shared/accounts/schemas.ts";

const t = useTestApp();

async function signedInAs(role: Role) {
  const kind = role === "buyer" ? "shop" : role === "admin" || role === "reviewer" ? "platform" : "service";
  const { users } = await buildCompany(kind, [role]);
  const agent = agentFor(t.app);
  await agent
    .post("/api/auth/sign-in")
    .send({ email: users[role]!.email, password: TEST_PASSWORD })
    .expect(200);
  return agent;
}

describe("role checks", () => {
  it("answers 401 to an anonymous caller of an admin route", async () => {
    const res = await request(t.app).get("/api/admin/users");

    expect(res.status).toBe(401);
  });

  it.each(["provider_admin", "technician", "reviewer", "buyer"] as const)(
    "answers 403 to a %s on an admin route",
    async (role) => {
      const agent = await signedInAs(role);

      const res = await agent.get("/api/admin/users");

      expect(res.status).toBe(403);
    },
  );

  it("lets an admin list users", async () => {
    const agent = await signedInAs("admin");

    const res = await agent.get("/api/admin/users");

    expect(res.status).toBe(200);
    expect(res.body.length).toBeGreaterThan(0);
    expect(JSON.stringify(res.body)).not.toMatch(/passwordHash|\$2[aby]\$/);
  });

  it("answers 401 to who-am-I when signed out, and 404 for an unknown API path", async () => {
    const me = await request(t.app).get("/api/auth/me");
    const missing = await request(t.app).get("/api/no-such-thing");

    expect(me.status).toBe(401);
    expect(missing.status).toBe(404);
  });
});

describe("health", () => {
  it("reports that the database is reachable", async () => {
    const res = await request(t.app).get("/api/health");

    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: "ok", database: "up" });
  });
});
