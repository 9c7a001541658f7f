import { describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { agentFor, sequelize, useTestApp } from "../../support/test-app.ts";
import { buildCompany, TEST_PASSWORD } from "../../support/build-company.ts";

const t = useTestApp();

const HOUR = 3_600_000;

async function signedIn() {
  const { users } = await buildCompany("shop", ["buyer"]);
  const agent = agentFor(t.app);
  const res = await agent
    .post("/api/auth/sign-in")
    .send({ email: users.buyer!.email, password: TEST_PASSWORD });
  const sid = decodeURIComponent(String(res.headers["set-cookie"]?.[0]).split(";")[0]!.split("=")[1]!)
    .slice(2)
    .split(".")[0]!;
  return { agent, sid };
}

async function expiryOf(sid: string): Promise<number> {
  const [row] = await sequelize().query<{ expire: Date }>("SELECT expire FROM session WHERE sid = $1", {
    bind: [sid],
    type: QueryTypes.SELECT,
  });
  return new Date(row!.expire).getTime();
}

/** Moves the stored session's end (row and cookie copy) to `left` ms from now, as if time had passed. */
async function leaveOnly(sid: string, left: number) {
  const expires = new Date(Date.now() + left);
  await sequelize().query(
    `UPDATE session SET expire = $2, sess = jsonb_set(sess::jsonb, '{cookie,expires}', to_jsonb($3::text))::json
      WHERE sid = $1`,
    { bind: [sid, expires, expires.toISOString()] },
  );
}

describe("session renewal", () => {
  it("does not write the session row or resend the cookie while more than half a shift is left", async () => {
    const { agent, sid } = await signedIn();
    await leaveOnly(sid, 6 * HOUR);
    const before = await expiryOf(sid);

    const res = await agent.get("/api/auth/me");

    expect(res.status).toBe(200);
    expect(res.headers["set-cookie"]).toBeUndefined();
    expect(await expiryOf(sid)).toBe(before);
  });

  it("pushes the end back to a whole shift once less than half a shift is left", async () => {
    const { agent, sid } = await signedIn();
    await leaveOnly(sid, 1 * HOUR);

    const res = await agent.get("/api/auth/me");

    expect(res.status).toBe(200);
    expect(String(res.headers["set-cookie"])).toMatch(/clearbench\.sid=/);
    expect(await expiryOf(sid)).toBeGreaterThan(Date.now() + 7.9 * HOUR); // one 8-hour shift, common practice
  });
});
