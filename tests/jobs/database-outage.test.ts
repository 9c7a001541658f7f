import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { ChildProcess } from "node:child_process";
import pg from "pg";
import request from "supertest";
import { startEmbeddedPostgres, type EmbeddedPostgres } from "../../server/db/embedded-postgres.ts";
import { hashPassword, setPasswordCost } from "../../server/accounts/passwords.ts";
import { freePort } from "../support/free-port.ts";
import { startServerProcess, stopProcess } from "../support/server-process.ts";
import { submitLiabilityCertificate } from "../support/submit-credential.ts";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../shared/api/error-body.ts";

// A cluster of its own and the server as its own process: this test stops PostgreSQL under a running server.
let root: string;
let port: number;
let postgres: EmbeddedPostgres;
let server: { child: ChildProcess; url: string };
beforeAll(async () => {
  root = mkdtempSync(path.join(tmpdir(), "clearbench-outage-"));
  port = await freePort();
  postgres = await startEmbeddedPostgres({ root, port, database: "outage", throwAway: true });
  server = await startServerProcess({
    DATABASE_URL: postgres.url,
    PORT: "0",
    UPLOADS_DIR: path.join(root, "uploads"),
    RUN_SCHEDULE: "false",
    NODE_ENV: "test",
    BCRYPT_COST: "4",
  });
}, 60_000);
afterAll(async () => {
  if (server) await stopProcess(server.child);
  postgres?.stop();
  rmSync(root, { recursive: true, force: true });
});

const agent = () => {
  const a = request.agent(server.url);
  a.set(CSRF_HEADER, CSRF_HEADER_VALUE);
  return a;
};

async function sql<T extends pg.QueryResultRow>(text: string, values: unknown[] = []): Promise<T[]> {
  const client = new pg.Client({ connectionString: postgres.url });
  await client.connect();
  try {
    return (await client.query<T>(text, values)).rows;
  } finally {
    await client.end();
  }
}

describe("PostgreSQL stopped and restarted under a running server", () => {
  it("answers 503 quickly during the outage, recovers by itself, and half-writes nothing", async () => {
    const provider = agent();
    await provider
      .post("/api/auth/sign-up")
      .send({
        kind: "service",
        companyName: "Fernhollow Spindle Repair LLC",
        addressLine: "3 Gantry Row",
        postalCode: "60601",
        name: "Ines Marwood",
        email: "office@fernhollow.test",
        password: "outage password 1",
      })
      .expect(201);
    setPasswordCost(4);
    const [platform] = await sql<{ id: number }>(
      "INSERT INTO companies (name, kind, time_zone) VALUES ('Outage Platform', 'platform', 'America/Chicago') RETURNING id",
    );
    await sql(
      "INSERT INTO users (company_id, email, name, role, password_hash) VALUES ($1, 'reviewer@outage.test', 'Olek Brandvold', 'reviewer', $2)",
      [platform!.id, await hashPassword("outage password 2")],
    );
    const reviewer = agent();
    await reviewer
      .post("/api/auth/sign-in")
      .send({ email: "reviewer@outage.test", password: "outage password 2" })
      .expect(200);
    const credential = await submitLiabilityCertificate(provider, 81);

    postgres.stop();
    const started = Date.now();
    const during = await Promise.all([
      reviewer.post(`/api/credentials/${credential.id}/verify`).send({}),
      reviewer.get("/api/review/queue"),
      request(server.url).get("/api/health"),
    ]);
    const outageAnswerMs = Date.now() - started;
    postgres = await startEmbeddedPostgres({ root, port, database: "outage", throwAway: true });
    let recovered = 0;
    for (let i = 0; i < 40 && recovered !== 200; i += 1) {
      recovered = (await reviewer.get("/api/review/queue")).status;
      if (recovered !== 200) await new Promise((r) => setTimeout(r, 250));
    }
    const [stateAfter] = await sql<{ state: string }>("SELECT state FROM credentials WHERE id = $1", [
      credential.id,
    ]);
    const [decisions] = await sql<{ n: number }>(
      "SELECT count(*)::int AS n FROM audit_events WHERE subject_type = 'credential' AND subject_id = $1 AND action = 'credential.verified'",
      [credential.id],
    );
    const verifyAgain = await reviewer.post(`/api/credentials/${credential.id}/verify`).send({});

    expect(during.map((r) => r.status)).toEqual([503, 503, 503]);
    expect(during[0]!.body.error.code).toBe("unavailable");
    // A correctness bound (the server must not hang on a dead database), not a speed target.
    expect(outageAnswerMs).toBeLessThan(8_000);
    expect(server.child.exitCode).toBeNull();
    expect(recovered).toBe(200);
    expect(stateAfter!.state).toBe("submitted");
    expect(decisions!.n).toBe(0);
    expect(verifyAgain.status).toBe(200);
  }, 90_000);
});
