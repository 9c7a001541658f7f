import { describe, expect, it } from "vitest";
import { useTestApp } from "../../support/test-app.ts";
import { buildProvider, signedInAgent } from "../../support/build-provider.ts";
import { certificateFields, submitLiabilityCertificate } from "../../support/submit-credential.ts";
import { buildCertificatePdf } from "../../fixtures/build-certificate-pdf.ts";
import { Credential } from "../../../server/credentials/model.ts";

const t = useTestApp();

describe("the reviewer's comparison with the previous verified version", () => {
  it("lists what changed since the verified version of the same policy, and nothing for a first upload", async () => {
    const provider = await buildProvider(t.app);
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");
    const first = await submitLiabilityCertificate(provider.admin, 81);
    const firstView = await reviewer.get(`/api/credentials/${first.id}`);
    await reviewer.post(`/api/credentials/${first.id}/verify`).send({});
    const { values } = await buildCertificatePdf({ seed: 81 });
    const before = certificateFields(values, "general_liability");
    const renewal = await submitLiabilityCertificate(provider.admin, 82, {
      ...before,
      insurerName: "Harrowgate Indemnity Co.",
      expirationDate: "2031-06-30",
      limits: { ...before.limits, eachOccurrence: 2_000_000 },
    });

    const seen = await reviewer.get(`/api/credentials/${renewal.id}`);

    expect(firstView.status).toBe(200);
    expect(firstView.body.previousVersion).toBeNull();
    expect(seen.status).toBe(200);
    expect(seen.body.previousVersion).toMatchObject({ id: first.id, state: "verified" });
    expect(seen.body.previousVersion.decidedAt).not.toBeNull();
    const changes = seen.body.previousVersion.changes as { path: string; before: unknown; after: unknown }[];
    expect(changes).toEqual(
      expect.arrayContaining([
        { path: "insurerName", before: before.insurerName, after: "Harrowgate Indemnity Co." },
        { path: "expirationDate", before: before.expirationDate, after: "2031-06-30" },
      ]),
    );
    const occurrence = changes.find((c) => c.path === "limits.eachOccurrence");
    expect(occurrence?.after).toBe(2_000_000);
    expect(changes.map((c) => c.path)).not.toContain("policyNumber");
  });

  it("compares a renewal that arrives after the lapse with the lapsed policy", async () => {
    const provider = await buildProvider(t.app);
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");
    const lapsed = await submitLiabilityCertificate(provider.admin, 87);
    await reviewer.post(`/api/credentials/${lapsed.id}/verify`).send({});
    await Credential.update({ state: "lapsed" }, { where: { id: lapsed.id } });
    const renewal = await submitLiabilityCertificate(provider.admin, 88);

    const seen = await reviewer.get(`/api/credentials/${renewal.id}`);

    expect(seen.body.previousVersion).toMatchObject({ id: lapsed.id, state: "lapsed" });
    expect(seen.body.previousVersion.changes.map((c: { path: string }) => c.path)).toContain("policyNumber");
  });

  it("compares only within the same holder: another company's verified policy is never the previous version", async () => {
    const mine = await buildProvider(t.app);
    const theirs = await buildProvider(t.app);
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");
    const other = await submitLiabilityCertificate(theirs.admin, 83);
    await reviewer.post(`/api/credentials/${other.id}/verify`).send({});
    const own = await submitLiabilityCertificate(mine.admin, 84);

    const seen = await reviewer.get(`/api/credentials/${own.id}`);

    expect(seen.body.previousVersion).toBeNull();
  });

  it("is not sent to the uploader's office, which reads its own documents without the reviewer's tools", async () => {
    const provider = await buildProvider(t.app);
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");
    const first = await submitLiabilityCertificate(provider.admin, 85);
    await reviewer.post(`/api/credentials/${first.id}/verify`).send({});
    const second = await submitLiabilityCertificate(provider.admin, 86);

    const office = await provider.admin.get(`/api/credentials/${second.id}`);

    expect(office.status).toBe(200);
    expect(office.body.previousVersion).toBeNull();
  });
});
