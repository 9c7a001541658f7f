import { describe, expect, it } from "vitest";
import request from "supertest";
import { useTestApp } from "../../support/test-app.ts";
import { buildProvider, signedInAgent } from "../../support/build-provider.ts";
import { submitLiabilityCertificate } from "../../support/submit-credential.ts";
import { useMailCatcher } from "../../support/mail-catcher.ts";
import { AuditEvent } from "../../../server/audit/model.ts";

const t = useTestApp();
const mail = useMailCatcher();

describe("verifying and returning", () => {
  it("verifies a submitted credential, audits it and e-mails the uploader", async () => {
    const provider = await buildProvider(t.app);
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");
    const credential = await submitLiabilityCertificate(provider.admin, 21);

    const res = await reviewer.post(`/api/credentials/${credential.id}/verify`).send({});
    await mail.deliver();
    const seen = await provider.admin.get(`/api/credentials/${credential.id}`);

    expect(res.status).toBe(200);
    expect(res.body.state).toBe("verified");
    expect(seen.body.audit.map((a: { action: string }) => a.action)).toEqual([
      "credential.submitted",
      "credential.verified",
    ]);
    expect(mail.to(provider.adminUser.email).map((m) => m.subject)).toEqual([
      expect.stringContaining("Verified"),
    ]);
  });

  it("returns a credential only with a reason, and the uploader sees the reason", async () => {
    const provider = await buildProvider(t.app);
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");
    const credential = await submitLiabilityCertificate(provider.admin, 22);

    const noReason = await reviewer.post(`/api/credentials/${credential.id}/return`).send({ reason: "" });
    const ok = await reviewer
      .post(`/api/credentials/${credential.id}/return`)
      .send({ reason: "The certificate lists a different named insured." });
    const seen = await provider.admin.get(`/api/credentials/${credential.id}`);

    expect(noReason.status).toBe(422);
    expect(noReason.body.error.fields[0].path).toBe("body.reason");
    expect(ok.body.state).toBe("returned");
    expect(seen.body.returnReason).toContain("different named insured");
  });

  it("lets exactly one of two reviewers deciding at once win; the other gets 409", async () => {
    const provider = await buildProvider(t.app);
    const { agent: first } = await signedInAgent(t.app, "platform", "reviewer");
    const { agent: second } = await signedInAgent(t.app, "platform", "reviewer");
    const credential = await submitLiabilityCertificate(provider.admin, 23);

    const results = await Promise.all([
      first.post(`/api/credentials/${credential.id}/verify`).send({}),
      second
        .post(`/api/credentials/${credential.id}/return`)
        .send({ reason: "Policy number is unreadable." }),
    ]);

    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
    const decisions = await AuditEvent.count({
      where: {
        subjectType: "credential",
        subjectId: credential.id,
        action: ["credential.verified", "credential.returned"],
      },
    });
    expect(decisions).toBe(1);
  });

  it("marks the older credential of the same type superseded when a newer one is verified", async () => {
    const provider = await buildProvider(t.app);
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");
    const older = await submitLiabilityCertificate(provider.admin, 24);
    await reviewer.post(`/api/credentials/${older.id}/verify`).send({}).expect(200);
    const newer = await submitLiabilityCertificate(provider.admin, 25);

    await reviewer.post(`/api/credentials/${newer.id}/verify`).send({}).expect(200);
    const olderNow = await provider.admin.get(`/api/credentials/${older.id}`);

    expect(olderNow.body.state).toBe("superseded");
  });

  it("records a reviewer's field edit with before and after", async () => {
    const provider = await buildProvider(t.app);
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");
    const credential = await submitLiabilityCertificate(provider.admin, 26);
    const current = (await reviewer.get(`/api/credentials/${credential.id}`)).body;

    const edited = await reviewer
      .patch(`/api/credentials/${credential.id}/fields`)
      .send({ fields: { ...current.fields, policyNumber: "GL-CORRECTED-1" } });
    const seen = await reviewer.get(`/api/credentials/${credential.id}`);

    expect(edited.status).toBe(200);
    const edit = seen.body.audit.find((a: { action: string }) => a.action === "credential.fields_edited");
    expect(edit.before.policyNumber).toBe(current.fields.policyNumber);
    expect(edit.after.policyNumber).toBe("GL-CORRECTED-1");
  });

  it("refuses decisions from anyone but a reviewer", async () => {
    const provider = await buildProvider(t.app);
    const { agent: buyer } = await signedInAgent(t.app, "shop", "buyer");
    const credential = await submitLiabilityCertificate(provider.admin, 27);

    const anonymous = await request(t.app)
      .post(`/api/credentials/${credential.id}/verify`)
      .set("x-clearbench-csrf", "1")
      .send({});
    const byProvider = await provider.admin.post(`/api/credentials/${credential.id}/verify`).send({});
    const byBuyer = await buyer.post(`/api/credentials/${credential.id}/verify`).send({});

    expect(anonymous.status).toBe(401);
    expect(byProvider.status).toBe(403);
    expect(byBuyer.status).toBe(403);
  });
});

describe("the verification queue", () => {
  it("lists submitted credentials oldest first with their waiting time, filtered by company", async () => {
    const provider = await buildProvider(t.app);
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");
    const a = await submitLiabilityCertificate(provider.admin, 31);
    const b = await submitLiabilityCertificate(provider.admin, 32);

    const res = await reviewer.get(`/api/review/queue?companyId=${provider.company.id}`);
    const desc = await reviewer.get(`/api/review/queue?companyId=${provider.company.id}&dir=desc`);
    const bad = await reviewer.get(`/api/review/queue?pageSize=500`);

    expect(res.status).toBe(200);
    expect(res.body.rows.map((r: { id: number }) => r.id)).toEqual([a.id, b.id]);
    expect(res.body.total).toBe(2);
    expect(res.body.rows[0].waitingHours).toBeGreaterThanOrEqual(0);
    expect(desc.body.rows.map((r: { id: number }) => r.id)).toEqual([b.id, a.id]);
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields[0].path).toBe("query.pageSize");
  });
});

describe("files are never served to the wrong party", () => {
  it("serves the file to its company with nosniff and an attachment disposition", async () => {
    const provider = await buildProvider(t.app);
    const credential = await submitLiabilityCertificate(provider.admin, 41);

    const res = await provider.admin.get(`/api/documents/${credential.documentId}/file`);

    expect(res.status).toBe(200);
    expect(res.headers["x-content-type-options"]).toBe("nosniff");
    expect(res.headers["content-disposition"]).toMatch(/^attachment;/);
    expect(res.headers["content-type"]).toBe("application/pdf");
  });

  it("answers another company's admin exactly as for a missing file, and 401 when signed out", async () => {
    const owner = await buildProvider(t.app);
    const intruder = await buildProvider(t.app);
    const credential = await submitLiabilityCertificate(owner.admin, 42);

    const guessed = await intruder.admin.get(`/api/documents/${credential.documentId}/file`);
    const missing = await intruder.admin.get(`/api/documents/99999999/file`);
    const credentialGuess = await intruder.admin.get(`/api/credentials/${credential.id}`);
    const otherTech = await intruder.tech.get(`/api/documents/${credential.documentId}/file`);
    const anonymous = await request(t.app).get(`/api/documents/${credential.documentId}/file`);

    expect(guessed.status).toBe(404);
    expect(guessed.body).toEqual(missing.body);
    expect(credentialGuess.status).toBe(404);
    expect(otherTech.status).toBe(404);
    expect(anonymous.status).toBe(401);
  });

  it("gives a buyer a verified certificate but not one awaiting verification", async () => {
    const provider = await buildProvider(t.app);
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");
    const { agent: buyer } = await signedInAgent(t.app, "shop", "buyer");
    const pending = await submitLiabilityCertificate(provider.admin, 43);
    const verified = await submitLiabilityCertificate(provider.admin, 44);
    await reviewer.post(`/api/credentials/${verified.id}/verify`).send({}).expect(200);

    const pendingFile = await buyer.get(`/api/documents/${pending.documentId}/file`);
    const verifiedFile = await buyer.get(`/api/documents/${verified.documentId}/file`);

    expect(pendingFile.status).toBe(404);
    expect(verifiedFile.status).toBe(200);
  });

  it("writes an audit event for each download", async () => {
    const provider = await buildProvider(t.app);
    const credential = await submitLiabilityCertificate(provider.admin, 45);

    await provider.admin.get(`/api/documents/${credential.documentId}/file`).expect(200);
    const downloads = await AuditEvent.count({
      where: { subjectType: "document", subjectId: credential.documentId, action: "document.downloaded" },
    });

    expect(downloads).toBe(1);
  });

  it("pages one at a time and keeps the total on a page past the end", async () => {
    const provider = await buildProvider(t.app);
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");
    const a = await submitLiabilityCertificate(provider.admin, 41);
    const b = await submitLiabilityCertificate(provider.admin, 42);
    const q = `/api/review/queue?companyId=${provider.company.id}&pageSize=1`;

    const first = await reviewer.get(`${q}&page=1`);
    const second = await reviewer.get(`${q}&page=2`);
    const past = await reviewer.get(`${q}&page=3`);

    expect(first.body).toMatchObject({ total: 2, page: 1, rows: [expect.objectContaining({ id: a.id })] });
    expect(second.body).toMatchObject({ total: 2, page: 2, rows: [expect.objectContaining({ id: b.id })] });
    expect(past.body).toMatchObject({ total: 2, page: 3, rows: [] });
  });
});
