import { describe, expect, it } from "vitest";
import { useTestApp } from "../../support/test-app.ts";
import { buildProvider, signedInAgent } from "../../support/build-provider.ts";
import { submitLiabilityCertificate } from "../../support/submit-credential.ts";

const t = useTestApp();

const awaiting = async (agent: Awaited<ReturnType<typeof buildProvider>>["admin"]) => {
  const res = await agent.get("/api/credentials");
  expect(res.status).toBe(200);
  const rows = (Array.isArray(res.body) ? res.body : res.body.items) as {
    id: number;
    awaitsHolder: boolean;
  }[];
  return new Map(rows.map((r) => [r.id, r.awaitsHolder]));
};

// Common practice of the office's overview: a returned certificate stays "returned to you" until a new one is sent.
describe("which returned credentials still wait for the office, as the server says", () => {
  it("keeps a returned certificate waiting until a newer one of the same coverage is uploaded", async () => {
    const provider = await buildProvider(t.app);
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");
    const first = await submitLiabilityCertificate(provider.admin, 41);
    await reviewer.post(`/api/credentials/${first.id}/return`).send({ reason: "The named insured differs." });

    expect((await awaiting(provider.admin)).get(first.id)).toBe(true);

    const second = await submitLiabilityCertificate(provider.admin, 42);
    const after = await awaiting(provider.admin);
    expect(after.get(first.id)).toBe(false);
    expect(after.get(second.id)).toBe(false);
  });
});
