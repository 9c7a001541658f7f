import { describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { agentFor, buildTestApp, useTestApp, signedInAs } from "../../support/test-app.ts";
import { buildCompany, TEST_PASSWORD } from "../../support/build-company.ts";
import { useMailCatcher } from "../../support/mail-catcher.ts";

const t = useTestApp();
const mail = useMailCatcher();

const linkToken = (text: string) => /set-password\?token=([A-Za-z0-9_-]+)/.exec(text)?.[1];

async function adminAgent() {
  const { users } = await buildCompany("platform", ["admin"]);
  const agent = await signedInAs(t.app, users.admin!.email);
  return agent;
}

describe("admin invitation", () => {
  it("e-mails a one-time set-password link over a real SMTP connection, and the link works once", async () => {
    const admin = await adminAgent();
    const { company } = await buildCompany("service", []);
    const email = `new-tech-${randomUUID().slice(0, 8)}@example.test`;

    const invited = await admin
      .post("/api/admin/invitations")
      .send({ email, name: "Wendell Achebe-Lund", role: "technician", companyId: company.id });
    await mail.deliver();
    const received = mail.to(email);
    const token = linkToken(received[0]?.text ?? "");
    const first = await agentFor(t.app)
      .post("/api/auth/set-password")
      .send({ token, password: "a brand new password" });
    const second = await agentFor(t.app)
      .post("/api/auth/set-password")
      .send({ token, password: "another new password" });
    const signIn = await agentFor(t.app)
      .post("/api/auth/sign-in")
      .send({ email, password: "a brand new password" });

    expect(invited.status).toBe(201);
    expect(received).toHaveLength(1);
    expect(received[0]!.subject).toContain("invited");
    expect(token).toBeDefined();
    expect(first.status).toBe(204);
    expect(second.status).toBe(422);
    expect(signIn.status).toBe(200);
  });

  it("refuses a role that does not fit the company, naming the field", async () => {
    const admin = await adminAgent();
    const { company } = await buildCompany("shop", []);

    const res = await admin.post("/api/admin/invitations").send({
      email: `x-${randomUUID().slice(0, 6)}@example.test`,
      name: "Ola Brightwater",
      role: "reviewer",
      companyId: company.id,
    });

    expect(res.status).toBe(422);
    expect(res.body.error.fields[0].path).toBe("body.role");
  });
});

describe("password reset", () => {
  it("answers the same for known and unknown e-mails and mails only the known one", async () => {
    const { users } = await buildCompany("shop", ["buyer"]);
    const known = users.buyer!.email;

    const a = await agentFor(t.app).post("/api/auth/password-reset").send({ email: known });
    const b = await agentFor(t.app)
      .post("/api/auth/password-reset")
      .send({ email: "ghost-account@example.test" });
    await mail.deliver();

    expect(a.status).toBe(202);
    expect(b.status).toBe(202);
    expect(a.body).toEqual(b.body);
    expect(mail.to(known)).toHaveLength(1);
    expect(mail.to("ghost-account@example.test")).toHaveLength(0);
  });

  it("sets a new password from the e-mailed link", async () => {
    const { users } = await buildCompany("shop", ["buyer"]);
    const email = users.buyer!.email;
    await agentFor(t.app).post("/api/auth/password-reset").send({ email });
    await mail.deliver();
    const token = linkToken(mail.to(email)[0]!.text);

    await agentFor(t.app)
      .post("/api/auth/set-password")
      .send({ token, password: "reset password 2026" })
      .expect(204);
    const oldPassword = await agentFor(t.app)
      .post("/api/auth/sign-in")
      .send({ email, password: TEST_PASSWORD });
    const newPassword = await agentFor(t.app)
      .post("/api/auth/sign-in")
      .send({ email, password: "reset password 2026" });

    expect(oldPassword.status).toBe(401);
    expect(newPassword.status).toBe(200);
  });
});

describe("after a password reset", () => {
  it("ends the user's other sessions and revokes the other outstanding links", async () => {
    const quick = buildTestApp({ RESET_EMAIL_INTERVAL_MINUTES: "0" });
    const { users } = await buildCompany("shop", ["buyer"]);
    const email = users.buyer!.email;
    const elsewhere = agentFor(quick.app);
    await elsewhere.post("/api/auth/sign-in").send({ email, password: TEST_PASSWORD }).expect(200);
    const bystander = (await buildCompany("shop", ["buyer"])).users.buyer!;
    const other = await signedInAs(quick.app, bystander.email);
    await agentFor(quick.app).post("/api/auth/password-reset").send({ email }).expect(202);
    await agentFor(quick.app).post("/api/auth/password-reset").send({ email }).expect(202);
    await mail.deliver();
    const [older, newer] = mail.to(email).map((m) => linkToken(m.text));

    const used = await agentFor(quick.app)
      .post("/api/auth/set-password")
      .send({ token: newer, password: "after the reset 2026" });
    const oldLink = await agentFor(quick.app)
      .post("/api/auth/set-password")
      .send({ token: older, password: "someone else's try" });
    const elsewhereMe = await elsewhere.get("/api/auth/me");
    const otherMe = await other.get("/api/auth/me");
    await quick.close();

    expect(older).toBeDefined();
    expect(newer).toBeDefined();
    expect(used.status).toBe(204);
    expect(oldLink.status).toBe(422);
    expect(elsewhereMe.status).toBe(401);
    expect(otherMe.status).toBe(200);
  });
});
