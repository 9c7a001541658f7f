import { describe, expect, it } from "vitest";
import request from "supertest";
import { agentFor, buildTestApp, useTestApp } from "../../support/test-app.ts";
import { buildCompany, TEST_PASSWORD } from "../../support/build-company.ts";
import { CSRF_HEADER } from "../../../shared/api/error-body.ts";

const t = useTestApp();

const sessionCookie = (res: request.Response) =>
  ([] as string[])
    .concat(res.headers["set-cookie"] ?? [])
    .find((c) => c.startsWith("clearbench.sid="))
    ?.split(";")[0];

describe("sign-in", () => {
  it("signs in with the right password and says who is signed in", async () => {
    const { users, company } = await buildCompany("service", ["provider_admin"]);
    const agent = agentFor(t.app);

    const res = await agent
      .post("/api/auth/sign-in")
      .send({ email: users.provider_admin!.email, password: TEST_PASSWORD });
    const me = await agent.get("/api/auth/me");

    expect(res.status).toBe(200);
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({
      email: users.provider_admin!.email,
      role: "provider_admin",
      companyId: company.id,
      companyKind: "service",
    });
    expect(JSON.stringify(me.body)).not.toContain("passwordHash");
  });

  it("answers the same for an unknown e-mail and a wrong password", async () => {
    const { users } = await buildCompany("service", ["provider_admin"]);

    const wrong = await agentFor(t.app)
      .post("/api/auth/sign-in")
      .send({ email: users.provider_admin!.email, password: "not the password" });
    const unknown = await agentFor(t.app)
      .post("/api/auth/sign-in")
      .send({ email: "nobody-here@example.test", password: "not the password" });

    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
  });

  it("gives a new session id at sign-in, so a planted session cannot be taken over", async () => {
    const { users } = await buildCompany("shop", ["buyer"]);
    const agent = agentFor(t.app);
    const failed = await agent
      .post("/api/auth/sign-in")
      .send({ email: users.buyer!.email, password: "wrong password" });
    const before = sessionCookie(failed);

    const ok = await agent
      .post("/api/auth/sign-in")
      .send({ email: users.buyer!.email, password: TEST_PASSWORD });
    const after = sessionCookie(ok);

    expect(after).toBeDefined();
    expect(after).not.toEqual(before);
  });

  it("ends the session on the server at sign-out, so the old cookie no longer works", async () => {
    const { users } = await buildCompany("shop", ["buyer"]);
    const agent = agentFor(t.app);
    const signedIn = await agent
      .post("/api/auth/sign-in")
      .send({ email: users.buyer!.email, password: TEST_PASSWORD });
    const cookie = sessionCookie(signedIn)!;

    const out = await agent.post("/api/auth/sign-out");
    const replay = await request(t.app).get("/api/auth/me").set("Cookie", cookie);

    expect(out.status).toBe(204);
    expect(replay.status).toBe(401);
  });

  it("refuses a state-changing request without the CSRF header", async () => {
    const { users } = await buildCompany("service", ["provider_admin"]);

    const res = await request(t.app)
      .post("/api/auth/sign-in")
      .send({ email: users.provider_admin!.email, password: TEST_PASSWORD });

    expect(res.status).toBe(403);
    expect(res.body.error.message).toContain(CSRF_HEADER);
  });

  it("names the field when the body breaks a rule", async () => {
    const res = await agentFor(t.app).post("/api/auth/sign-in").send({ email: "not-an-email", password: "" });

    expect(res.status).toBe(422);
    const paths = res.body.error.fields.map((f: { path: string }) => f.path);
    expect(paths).toEqual(expect.arrayContaining(["body.email", "body.password"]));
  });

  it("answers 400 for a body that is not JSON", async () => {
    const res = await agentFor(t.app)
      .post("/api/auth/sign-in")
      .set("Content-Type", "application/json")
      .send("{not json");

    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("bad_request");
  });

  it("rate limits repeated failed sign-ins with 429", async () => {
    const limited = buildTestApp({ SIGN_IN_ATTEMPTS_PER_15_MIN: "3" });
    const { users } = await buildCompany("service", ["provider_admin"]);
    const attempt = () =>
      agentFor(limited.app)
        .post("/api/auth/sign-in")
        .send({ email: users.provider_admin!.email, password: "wrong password" });

    const statuses = [];
    for (let i = 0; i < 4; i += 1) statuses.push((await attempt()).status);
    await limited.close();

    expect(statuses).toEqual([401, 401, 401, 429]);
  });
});
