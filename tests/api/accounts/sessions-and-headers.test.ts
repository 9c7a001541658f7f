import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import pg from "pg";
import request from "supertest";
import { agentFor, buildTestApp, useTestApp } from "../../support/test-app.ts";
import { buildCompany, TEST_PASSWORD } from "../../support/build-company.ts";
import { ensureClientBuild } from "../../support/browser-server.ts";
import { createApp } from "../../../server/app.ts";
import { loadConfig } from "../../../server/config.ts";
import { issueToken } from "../../../server/accounts/tokens.ts";
import { OneTimeToken } from "../../../server/accounts/model.ts";

const t = useTestApp();

describe("session cookie and headers in production", () => {
  it("sets the session cookie HttpOnly, Secure and SameSite=Lax", async () => {
    const prod = buildTestApp({
      NODE_ENV: "production",
      SESSION_SECRET: "a-production-secret-of-some-length",
      GATE_SECRET: "a-production-gate-secret-of-32-or-more",
    });
    const { users } = await buildCompany("shop", ["buyer"]);

    const res = await agentFor(prod.app)
      .post("/api/auth/sign-in")
      .set("X-Forwarded-Proto", "https")
      .send({ email: users.buyer!.email, password: TEST_PASSWORD });
    await prod.close();

    const cookie = ([] as string[])
      .concat(res.headers["set-cookie"] ?? [])
      .find((c) => c.startsWith("clearbench.sid="))!;
    expect(res.status).toBe(200);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/Secure/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
  });

  it("refuses to start in production with the demo session secret", () => {
    expect(() => loadConfig({ NODE_ENV: "production" })).toThrow(/SESSION_SECRET/);
  });

  it("refuses to start in production without its own gate secret", () => {
    const env = { NODE_ENV: "production", SESSION_SECRET: "a-production-secret-of-some-length" };
    expect(() => loadConfig(env)).toThrow(/GATE_SECRET/);
    expect(() => loadConfig({ ...env, GATE_SECRET: "too-short" })).toThrow(/GATE_SECRET/);
    expect(
      loadConfig({ ...env, GATE_SECRET: "a-production-gate-secret-of-32-or-more" }).GATE_SECRET,
    ).toBeDefined();
  });

  it("hashes passwords with a bcrypt cost of at least 12 by default", () => {
    expect(loadConfig({}).BCRYPT_COST).toBeGreaterThanOrEqual(12);
  });

  it("serves the built client under a CSP with no inline script, and the client has none", async () => {
    const dist = ensureClientBuild();
    const pool = new pg.Pool({ connectionString: t.config.DATABASE_URL, max: 1 });
    const app = createApp({ config: t.config, sessionPool: pool, clientDir: dist });

    const res = await request(app).get("/sign-in");
    const html = readFileSync(path.join(dist, "index.html"), "utf8");
    await pool.end();

    const csp = res.headers["content-security-policy"] as string;
    expect(res.status).toBe(200);
    const scriptSrc = csp.split(";").find((d) => d.trim().startsWith("script-src"));
    expect(scriptSrc?.trim()).toBe("script-src 'self'");
    const scripts = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/g)];
    expect(scripts.length).toBeGreaterThan(0);
    for (const [, attributes, body] of scripts) {
      expect(attributes).toContain("src=");
      expect(body!.trim()).toBe("");
    }
  });
});

describe("one-time links", () => {
  it("refuses an expired set-password link", async () => {
    const { users } = await buildCompany("shop", ["buyer"]);
    const token = await issueToken(users.buyer!.id, "reset");
    await OneTimeToken.update(
      { expiresAt: new Date(Date.now() - 1000) },
      { where: { userId: users.buyer!.id } },
    );

    const res = await agentFor(t.app)
      .post("/api/auth/set-password")
      .send({ token, password: "a fresh password" });

    expect(res.status).toBe(422);
    expect(res.body.error.fields[0].path).toBe("body.token");
  });
});
