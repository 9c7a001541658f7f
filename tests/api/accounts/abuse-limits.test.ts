import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { randomUUID } from "node:crypto";
import bcrypt from "bcrypt";
import { agentFor, buildTestApp, type TestApp } from "../../support/test-app.ts";
import { buildCompany } from "../../support/build-company.ts";
import { startTestMailCatcher } from "../../support/mail-catcher.ts";

let mail: Awaited<ReturnType<typeof startTestMailCatcher>>;
const apps: TestApp[] = [];
beforeAll(async () => {
  mail = await startTestMailCatcher();
});
afterEach(() => vi.restoreAllMocks());
afterAll(async () => {
  await Promise.all(apps.map((a) => a.close()));
  await mail.close();
});

function appWith(overrides: Record<string, string> = {}) {
  const t = buildTestApp(overrides);
  apps.push(t);
  return t.app;
}

const unique = (what: string) => `${what}-${randomUUID().slice(0, 8)}@example.test`;
const bogusToken = () => randomUUID().replaceAll("-", "");

const signUpBody = (email: string) => ({
  kind: "shop",
  companyName: "Quarry Hollow Fixtures LLC",
  addressLine: "12 Anvil Row",
  postalCode: "60601",
  name: "Imre Castellan",
  email,
  password: "a long enough password",
});

describe("costly work only after cheap checks", () => {
  it("answers a bogus set-password link without hashing the password", async () => {
    const app = appWith();
    const hash = vi.spyOn(bcrypt, "hash");

    const answers = [];
    for (let i = 0; i < 5; i += 1) {
      answers.push(
        await agentFor(app)
          .post("/api/auth/set-password")
          .send({ token: bogusToken(), password: "a new password here" }),
      );
    }

    expect(answers.map((a) => a.status)).toEqual([422, 422, 422, 422, 422]);
    expect(answers[0]!.body.error.fields[0].path).toBe("body.token");
    expect(hash).not.toHaveBeenCalled();
  });

  it("refuses a sign-up with a taken e-mail without hashing the password", async () => {
    const app = appWith();
    const { users } = await buildCompany("shop", ["buyer"]);
    const hash = vi.spyOn(bcrypt, "hash");

    const res = await agentFor(app).post("/api/auth/sign-up").send(signUpBody(users.buyer!.email));

    expect(res.status).toBe(409);
    expect(hash).not.toHaveBeenCalled();
  });

  it("compares an unknown e-mail's password against a hash of the configured cost", async () => {
    const app = appWith({ BCRYPT_COST: "5" });
    const compare = vi.spyOn(bcrypt, "compare");

    const res = await agentFor(app)
      .post("/api/auth/sign-in")
      .send({ email: unique("nobody"), password: "whatever it is" });

    expect(res.status).toBe(401);
    expect(compare).toHaveBeenCalledTimes(1);
    expect(bcrypt.getRounds(String(compare.mock.calls[0]![1]))).toBe(5);
  });
});

describe("hashing under load", () => {
  it("answers 503 at once when more passwords wait to be checked than the queue holds", async () => {
    const app = appWith({ BCRYPT_COST: "10", HASH_CONCURRENCY: "1", HASH_QUEUE: "1" });
    const { users } = await buildCompany("shop", ["buyer"]);

    const answers = await Promise.all(
      Array.from({ length: 6 }, () =>
        agentFor(app).post("/api/auth/sign-in").send({ email: users.buyer!.email, password: "not this one" }),
      ),
    );
    const statuses = answers.map((a) => a.status);

    expect(statuses.filter((s) => s === 401).length).toBeGreaterThanOrEqual(1);
    expect(statuses.filter((s) => s === 503).length).toBeGreaterThanOrEqual(1);
    expect(statuses.every((s) => s === 401 || s === 503)).toBe(true);
    expect(answers.find((a) => a.status === 503)!.body.error.code).toBe("unavailable");
  });
});

describe("limits per address", () => {
  it("stops failed sign-ins from one address even when every attempt names another e-mail", async () => {
    const app = appWith({ SIGN_IN_FAILURES_PER_IP_PER_15_MIN: "3" });

    const statuses = [];
    for (let i = 0; i < 4; i += 1) {
      const res = await agentFor(app)
        .post("/api/auth/sign-in")
        .send({ email: unique("rotating"), password: "guessing again" });
      statuses.push(res.status);
    }

    expect(statuses).toEqual([401, 401, 401, 429]);
  });

  it("stops sign-ups from one address", async () => {
    const app = appWith({ SIGN_UPS_PER_IP_PER_HOUR: "2" });

    const statuses = [];
    for (let i = 0; i < 3; i += 1) {
      statuses.push(
        (
          await agentFor(app)
            .post("/api/auth/sign-up")
            .send(signUpBody(unique("signup")))
        ).status,
      );
    }

    expect(statuses).toEqual([201, 201, 429]);
  });

  it("stops reset requests from one address", async () => {
    const app = appWith({ PASSWORD_RESETS_PER_IP_PER_15_MIN: "3" });

    const statuses = [];
    for (let i = 0; i < 4; i += 1) {
      const res = await agentFor(app)
        .post("/api/auth/password-reset")
        .send({ email: unique("reset") });
      statuses.push(res.status);
    }

    expect(statuses).toEqual([202, 202, 202, 429]);
  });

  it("stops guessing set-password links from one address", async () => {
    const app = appWith({ SET_PASSWORD_FAILURES_PER_IP_PER_15_MIN: "3" });

    const statuses = [];
    for (let i = 0; i < 4; i += 1) {
      const res = await agentFor(app)
        .post("/api/auth/set-password")
        .send({ token: bogusToken(), password: "a new password here" });
      statuses.push(res.status);
    }

    expect(statuses).toEqual([422, 422, 422, 429]);
  });
});

describe("limits per account", () => {
  it("sends one reset e-mail for many requests in a few minutes, answering each the same", async () => {
    const app = appWith({
      PASSWORD_RESETS_PER_IP_PER_15_MIN: "1000",
      PASSWORD_RESETS_PER_EMAIL_PER_HOUR: "1000",
    });
    const { users } = await buildCompany("shop", ["buyer"]);
    const email = users.buyer!.email;

    const answers = await Promise.all(
      Array.from({ length: 50 }, () => agentFor(app).post("/api/auth/password-reset").send({ email })),
    );
    await mail.deliver();

    expect(new Set(answers.map((a) => a.status))).toEqual(new Set([202]));
    expect(new Set(answers.map((a) => JSON.stringify(a.body))).size).toBe(1);
    expect(mail.to(email)).toHaveLength(1);
  });

  it("limits reset requests naming one e-mail, whoever sends them", async () => {
    const app = appWith({ PASSWORD_RESETS_PER_EMAIL_PER_HOUR: "2" });
    const email = unique("target");

    const statuses = [];
    for (let i = 0; i < 3; i += 1) {
      statuses.push((await agentFor(app).post("/api/auth/password-reset").send({ email })).status);
    }

    expect(statuses).toEqual([202, 202, 429]);
  });

  it("limits sign-ups naming one e-mail", async () => {
    const app = appWith({ SIGN_UPS_PER_EMAIL_PER_HOUR: "1" });
    const email = unique("again");

    const first = await agentFor(app).post("/api/auth/sign-up").send(signUpBody(email));
    const second = await agentFor(app).post("/api/auth/sign-up").send(signUpBody(email));

    expect(first.status).toBe(201);
    expect(second.status).toBe(429);
  });
});
