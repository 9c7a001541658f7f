import { describe, expect, it } from "vitest";
import { agentFor, sequelize, useTestApp } from "../../support/test-app.ts";
import { buildCompany, TEST_PASSWORD } from "../../support/build-company.ts";

// The session row and its user are read in one statement; these checks hold that read to what the separate user
// look-up guaranteed: the account as it is now, not as it was when the session began (common practice).
const t = useTestApp();

async function signedInBuyer() {
  const { users } = await buildCompany("shop", ["buyer"]);
  const agent = agentFor(t.app);
  const res = await agent
    .post("/api/auth/sign-in")
    .send({ email: users.buyer!.email, password: TEST_PASSWORD });
  expect(res.status).toBe(200);
  return { agent, user: users.buyer! };
}

describe("session user read with the session row", () => {
  it("answers as the signed-in user, with the name as stored now", async () => {
    const { agent, user } = await signedInBuyer();
    expect((await agent.get("/api/auth/me")).body).toMatchObject({ id: user.id, email: user.email });
    await sequelize().query("UPDATE users SET name = 'Renamed Buyer' WHERE id = $1", { bind: [user.id] });
    const me = await agent.get("/api/auth/me");
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ id: user.id, name: "Renamed Buyer" });
  });

  it("ends the session at the next request once the account is deactivated", async () => {
    const { agent, user } = await signedInBuyer();
    await sequelize().query("UPDATE users SET active = false WHERE id = $1", { bind: [user.id] });
    expect((await agent.get("/api/auth/me")).status).toBe(401);
    expect((await agent.get("/api/directory")).status).toBe(401);
  });

  it("applies a role change at the next request", async () => {
    const { agent, user } = await signedInBuyer();
    expect((await agent.get("/api/directory")).status).toBe(200);
    await sequelize().query("UPDATE users SET role = 'admin' WHERE id = $1", { bind: [user.id] });
    const me = await agent.get("/api/auth/me");
    expect(me.body).toMatchObject({ id: user.id, role: "admin" });
  });
});
