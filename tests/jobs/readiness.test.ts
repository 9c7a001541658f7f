import { afterAll, describe, expect, it } from "vitest";
import path from "node:path";
import { tmpdir } from "node:os";
import pg from "pg";
import request from "supertest";
import { loadConfig } from "../../server/config.ts";
import { startServer, type RunningServer } from "../../server/main.ts";
import { createTestDatabase } from "../support/test-database.ts";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../shared/api/error-body.ts";

// The server in this process on a database of its own, so the test can hold its start-up open and drop the database.
let running: RunningServer | undefined;
afterAll(async () => {
  await running?.close().catch(() => undefined);
});

describe("readiness", () => {
  it("answers 503 on health and every API route until start-up work is done, while liveness answers throughout", async () => {
    const database = await createTestDatabase("ready");
    const config = loadConfig({
      ...process.env,
      DATABASE_URL: database.url,
      PORT: "0",
      RUN_SCHEDULE: "false",
      UPLOADS_DIR: path.join(tmpdir(), `clearbench-ready-${database.name}`),
    });
    let finishPrepare!: () => void;
    const prepared = new Promise<void>((resolve) => (finishPrepare = resolve));
    let url = "";
    let onListening!: () => void;
    const listening = new Promise<void>((resolve) => (onListening = resolve));
    const started = startServer(config, {
      prepare: () => prepared,
      onListening: (port) => {
        url = `http://127.0.0.1:${port}`;
        onListening();
      },
    });
    await listening;
    const duringStart = {
      health: (await request(url).get("/api/health")).status,
      ready: (await request(url).get("/api/health/ready")).status,
      live: (await request(url).get("/api/health/live")).status,
      signIn: (
        await request(url)
          .post("/api/auth/sign-in")
          .set(CSRF_HEADER, CSRF_HEADER_VALUE)
          .send({ email: "someone@example.test", password: "whatever it is" })
      ).status,
    };
    finishPrepare();
    running = await started;
    const base = `http://127.0.0.1:${running.port}`;
    const afterStart = {
      health: (await request(base).get("/api/health")).status,
      ready: (await request(base).get("/api/health/ready")).status,
      live: (await request(base).get("/api/health/live")).status,
    };
    const admin = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await admin.connect();
    await admin.query(`DROP DATABASE ${database.name} WITH (FORCE)`);
    await admin.end();
    const readyWithoutDatabase = await request(base).get("/api/health/ready");
    const liveWithoutDatabase = await request(base).get("/api/health/live");

    expect(url).toBe(base);
    expect(duringStart).toEqual({ health: 503, ready: 503, live: 200, signIn: 503 });
    expect(afterStart).toEqual({ health: 200, ready: 200, live: 200 });
    expect(readyWithoutDatabase.status).toBe(503);
    expect(readyWithoutDatabase.body.database).toBe("down");
    expect(liveWithoutDatabase.status).toBe(200);
  }, 60_000);
});
