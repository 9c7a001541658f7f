import type { Express } from "express";
import { agentFor } from "../../support/test-app.ts";
import { TEST_PASSWORD } from "../../support/build-company.ts";

/** A signed-in supertest agent for a user the test built. */
export async function signIn(app: Express, email: string) {
  const agent = agentFor(app);
  await agent.post("/api/auth/sign-in").send({ email, password: TEST_PASSWORD }).expect(200);
  return agent;
}
