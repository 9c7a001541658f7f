import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import request from "supertest";
import { startEmbeddedPostgres, type EmbeddedPostgres } from "../../server/db/embedded-postgres.ts";
import { loadConfig } from "../../server/config.ts";
import { startServer, type RunningServer } from "../../server/main.ts";
import { User } from "../../server/accounts/model.ts";
import { Company } from "../../server/companies/model.ts";
import { hashPassword } from "../../server/accounts/passwords.ts";
import { Credential } from "../../server/credentials/model.ts";
import { AuditEvent } from "../../server/audit/model.ts";
import { freePort } from "../support/free-port.ts";
import { submitLiabilityCertificate } from "../support/submit-credential.ts";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../shared/api/error-body.ts";

// A cluster of its own: this test stops PostgreSQL under a running server.
let root: string;
let port: number;
let postgres: EmbeddedPostgres;
let server: RunningServer;
let base: string;
beforeAll(async () => {
  root = mkdtempSync(path.join(tmpdir(), "clearbench-outage-"));
  port = await freePort();
  postgres = await startEmbeddedPostgres({ root, port, database: "outage", throwAway: true });
  server = await startServer(
    loadConfig({
      ...process.env,
      DATABASE_URL: postgres.url,
      PORT: "0",
      UPLOADS_DIR: path.join(root, "uploads"),
      RUN_SCHEDULE: "false",
    }),
  );
  base = `http://127.0.0.1:${server.port}`;
}, 60_000);
afterAll(async () => {
  await server?.close().catch(() => undefined);
  postgres?.stop();
  rmSync(root, { recursive: true, force: true });
});

async function signedIn(email: string, password: string) {
  const agent = request.agent(base);
  agent.set(CSRF_HEADER, CSRF_HEADER_VALUE);
  await agent.post("/api/auth/sign-in").send({ email, password }).expect(200);
  return agent;
}

describe("PostgreSQL stopped and restarted under a running server", () => {
  it("answers 503 quickly during the outage, recovers by itself, and half-writes nothing", async () => {
    const password = "outage password 1";
    const hash = await hashPassword(password);
    const service = await Company.create({
      name: "Fernhollow Spindle Repair LLC",
      kind: "service",
      addressLine: "3 Gantry Row",
      postalCode: "60601",
      timeZone: "America/Chicago",
      latitude: null,
      longitude: null,
    });
    const platform = await Company.create({
      name: "Outage Platform",
      kind: "platform",
      addressLine: "1 Main",
      postalCode: "60601",
      timeZone: "America/Chicago",
      latitude: null,
      longitude: null,
    });
    await User.create({
      companyId: service.id,
      email: "office@fernhollow.test",
      name: "Ines Marwood",
      role: "provider_admin",
      passwordHash: hash,
    });
    await User.create({
      companyId: platform.id,
      email: "reviewer@outage.test",
      name: "Olek Brandvold",
      role: "reviewer",
      passwordHash: hash,
    });
    const provider = await signedIn("office@fernhollow.test", password);
    const reviewer = await signedIn("reviewer@outage.test", password);
    const credential = await submitLiabilityCertificate(provider, 81);

    postgres.stop();
    const started = Date.now();
    const during = await Promise.all([
      reviewer.post(`/api/credentials/${credential.id}/verify`).send({}),
      reviewer.get("/api/review/queue"),
      request(base).get("/api/health"),
    ]);
    const outageAnswerMs = Date.now() - started;
    postgres = await startEmbeddedPostgres({ root, port, database: "outage", throwAway: true });
    let recovered = 0;
    for (let i = 0; i < 20 && recovered !== 200; i += 1) {
      recovered = (await reviewer.get("/api/review/queue")).status;
      if (recovered !== 200) await new Promise((r) => setTimeout(r, 250));
    }
    const stateAfter = await Credential.findByPk(credential.id);
    const decisions = await AuditEvent.count({
      where: { subjectType: "credential", subjectId: credential.id, action: "credential.verified" },
    });
    const verifyAgain = await reviewer.post(`/api/credentials/${credential.id}/verify`).send({});

    expect(during.map((r) => r.status)).toEqual([503, 503, 503]);
    expect(during[0]!.body.error.code).toBe("unavailable");
    expect(outageAnswerMs).toBeLessThan(8_000);
    expect(recovered).toBe(200);
    expect(stateAfter!.state).toBe("submitted");
    expect(decisions).toBe(0);
    expect(verifyAgain.status).toBe(200);
  }, 90_000);
});
