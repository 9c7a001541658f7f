import pg from "pg";
import request from "supertest";
import type { Express } from "express";
import { loadConfig, type Config } from "../../server/config.ts";
import { configureLog } from "../../server/log.ts";
import { connectDatabase, db } from "../../server/db/sequelize.ts";
import { initModels } from "../../server/db/associations.ts";
import { createApp } from "../../server/app.ts";
import { setHashConcurrency, setPasswordCost } from "../../server/accounts/passwords.ts";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../shared/api/error-body.ts";
import { TEST_PASSWORD } from "./build-company.ts";
import { useForFile } from "./suite-hooks.ts";

export interface TestApp {
  app: Express;
  config: Config;
  close(): Promise<void>;
}

let connected = false;

/** The real app on the suite's PostgreSQL, without listening (supertest drives it). */
export function buildTestApp(overrides: Record<string, string> = {}): TestApp {
  const config = loadConfig({ CHECK_RESPONSE_SHAPES: "true", ...process.env, ...overrides });
  configureLog(config.LOG_LEVEL);
  setPasswordCost(config.BCRYPT_COST);
  setHashConcurrency(config.HASH_CONCURRENCY, config.HASH_QUEUE);
  if (!connected) {
    initModels(connectDatabase(config.DATABASE_URL!));
    connected = true;
  }
  const sessionPool = new pg.Pool({ connectionString: config.DATABASE_URL, max: 3 });
  const app = createApp({ config, sessionPool, clientDir: "/nonexistent" });
  return {
    app,
    config,
    close: async () => {
      await sessionPool.end();
    },
  };
}

/** The test app for the whole file: built in beforeAll, its session pool closed in afterAll. */
export function useTestApp(overrides: Record<string, string> = {}): TestApp {
  return useForFile(
    "the test app",
    () => buildTestApp(overrides),
    (t) => t.close(),
  );
}

export const sequelize = () => db();

/** A supertest agent that keeps cookies and sends the CSRF header on every request. */
export function agentFor(app: Express) {
  const agent = request.agent(app);
  agent.set(CSRF_HEADER, CSRF_HEADER_VALUE);
  return agent;
}

/** An agent signed in as the user with this e-mail and the suite's password. */
export async function signedInAs(app: Express, email: string) {
  const agent = agentFor(app);
  await agent.post("/api/auth/sign-in").send({ email, password: TEST_PASSWORD }).expect(200);
  return agent;
}
