import { describe, expect, it } from "vitest";
import { useTestApp } from "../../support/test-app.ts";
import { buildProvider, signedInAgent } from "../../support/build-provider.ts";
import { countStored } from "../../support/count-uploads.ts";
import {
  buildCertificatePdf,
  coverageCodes,
  randomCertificateValues,
} from "../../fixtures/build-certificate-pdf.ts";
import { certificateFields } from "../../support/submit-credential.ts";
import { Credential } from "../../../server/credentials/model.ts";

const t = useTestApp();

type Box = { page: number; x: number; y: number; w: number; h: number };
type Proposed = {
  typeCode: string;
  fields: Record<string, unknown>;
  found: string[];
  evidence: Record<string, { confidence: number; box?: Box }>;
};

async function uploadCertificate(
  agent: Awaited<ReturnType<typeof buildProvider>>["admin"],
  bytes: Uint8Array,
) {
  const res = await agent
    .post("/api/documents")
    .field("typeCode", "general_liability")
    .attach("file", Buffer.from(bytes), "certificate.pdf");
  expect(res.status).toBe(201);
  return res.body as {
    document: { id: number };
    certificate: { parties: Record<string, string>; coverages: Proposed[] };
  };
}

describe("one certificate of insurance, every coverage", () => {
  it("proposes one credential per coverage printed, each with its own policy, dates and limits", async () => {
    const { admin } = await buildProvider(t.app);
    const { bytes, values } = await buildCertificatePdf({ seed: 301 });

    const up = await uploadCertificate(admin, bytes);

    expect(up.certificate.coverages.map((c) => c.typeCode)).toEqual([...coverageCodes]);
    for (const coverage of up.certificate.coverages) {
      const written = values.coverages[coverage.typeCode as (typeof coverageCodes)[number]]!;
      expect(coverage.fields, coverage.typeCode).toMatchObject({
        policyNumber: written.policyNumber,
        effectiveDate: written.effectiveDate,
        expirationDate: written.expirationDate,
        limits: written.limits,
      });
    }
    expect(up.certificate.parties).toEqual({
      producer: values.producer.name,
      namedInsured: values.insured.name,
      certificateHolder: values.holder.name,
    });
  });

  it("sends every confirmed coverage in one request as credentials awaiting verification on the same document", async () => {
    const { admin, company } = await buildProvider(t.app);
    const { bytes, values } = await buildCertificatePdf({ seed: 302 });
    const up = await uploadCertificate(admin, bytes);

    const res = await admin.post("/api/credentials/coverages").send({
      documentId: up.document.id,
      credentials: coverageCodes.map((code) => ({ typeCode: code, fields: certificateFields(values, code) })),
    });

    expect(res.status).toBe(201);
    expect(res.body.credentials).toHaveLength(4);
    const rows = await Credential.findAll({ where: { companyId: company.id } });
    expect(rows.map((r) => r.typeCode).sort()).toEqual([...coverageCodes].sort());
    expect(new Set(rows.map((r) => r.documentId))).toEqual(new Set([up.document.id]));
    expect(rows.every((r) => r.state === "submitted" && r.lapsesAt !== null)).toBe(true);
  });

  it("lets the others through when one coverage cannot be read and is dropped", async () => {
    const { admin, company } = await buildProvider(t.app);
    const base = randomCertificateValues(303);
    const umbrella = base.coverages.umbrella_liability!;
    // A smudged policy number: nothing in that cell looks like a policy number, so it is left to the uploader.
    const { bytes, values } = await buildCertificatePdf({
      seed: 303,
      coverages: { ...base.coverages, umbrella_liability: { ...umbrella, policyNumber: "~~" } },
    });
    const up = await uploadCertificate(admin, bytes);
    const unreadable = up.certificate.coverages.find((c) => c.typeCode === "umbrella_liability");
    expect(unreadable?.found).not.toContain("policyNumber");

    const readable = coverageCodes.filter((code) => code !== "umbrella_liability");
    const res = await admin.post("/api/credentials/coverages").send({
      documentId: up.document.id,
      credentials: readable.map((code) => ({ typeCode: code, fields: certificateFields(values, code) })),
    });

    expect(res.status).toBe(201);
    const rows = await Credential.findAll({ where: { companyId: company.id } });
    expect(rows.map((r) => r.typeCode).sort()).toEqual([...readable].sort());
  });

  it("saves nothing when one coverage breaks its rules, and names that coverage's field", async () => {
    const { admin, company } = await buildProvider(t.app);
    const { bytes, values } = await buildCertificatePdf({ seed: 304 });
    const up = await uploadCertificate(admin, bytes);
    const before = await countStored(t.config.UPLOADS_DIR);
    const credentials = coverageCodes.map((code) => ({
      typeCode: code,
      fields: certificateFields(values, code),
    }));
    credentials[2] = { ...credentials[2]!, fields: { ...credentials[2]!.fields, policyNumber: "" } };

    const res = await admin
      .post("/api/credentials/coverages")
      .send({ documentId: up.document.id, credentials });

    expect(res.status).toBe(422);
    expect(res.body.error.fields).toEqual([
      expect.objectContaining({ path: "body.credentials.2.fields.policyNumber" }),
    ]);
    expect(await Credential.count({ where: { companyId: company.id } })).toBe(0);
    expect(await countStored(t.config.UPLOADS_DIR)).toEqual(before);
  });

  it("refuses a training card in the batch: cards stay one credential per card", async () => {
    const { admin, company } = await buildProvider(t.app);
    const { bytes, values } = await buildCertificatePdf({ seed: 305 });
    const up = await uploadCertificate(admin, bytes);

    const res = await admin.post("/api/credentials/coverages").send({
      documentId: up.document.id,
      credentials: [
        { typeCode: "general_liability", fields: certificateFields(values, "general_liability") },
        { typeCode: "lockout_tagout", fields: { holderName: "A. Person", issueDate: "2026-01-02" } },
      ],
    });

    expect(res.status).toBe(422);
    expect(res.body.error.fields[0].path).toBe("body.credentials.1.typeCode");
    expect(await Credential.count({ where: { companyId: company.id } })).toBe(0);
  });

  it("refuses coverages on a file uploaded as a technician's card", async () => {
    const { admin, company, technician } = await buildProvider(t.app);
    const { bytes, values } = await buildCertificatePdf({ seed: 307 });
    const asCard = await admin
      .post("/api/documents")
      .field("typeCode", "first_aid_cpr")
      .field("technicianId", String(technician.id))
      .attach("file", Buffer.from(bytes), "certificate.pdf");

    const res = await admin.post("/api/credentials/coverages").send({
      documentId: asCard.body.document.id,
      credentials: [
        { typeCode: "general_liability", fields: certificateFields(values, "general_liability") },
      ],
    });

    expect(asCard.status).toBe(201);
    expect(res.status).toBe(422);
    expect(res.body.error.fields[0].path).toBe("body.documentId");
    expect(await Credential.count({ where: { companyId: company.id } })).toBe(0);
  });

  it("refuses another company's document and the same coverage sent twice", async () => {
    const owner = await buildProvider(t.app);
    const other = await buildProvider(t.app);
    const { bytes, values } = await buildCertificatePdf({ seed: 306 });
    const up = await uploadCertificate(owner.admin, bytes);
    const gl = { typeCode: "general_liability", fields: certificateFields(values, "general_liability") };

    const foreign = await other.admin
      .post("/api/credentials/coverages")
      .send({ documentId: up.document.id, credentials: [gl] });
    const twice = await owner.admin
      .post("/api/credentials/coverages")
      .send({ documentId: up.document.id, credentials: [gl, gl] });

    expect(foreign.status).toBe(422);
    expect(foreign.body.error.fields[0].path).toBe("body.documentId");
    expect(twice.status).toBe(422);
    expect(await Credential.count({ where: { documentId: up.document.id } })).toBe(0);
  });

  it("lets the reviewer verify three coverages and return one, each on its own", async () => {
    const { admin, company } = await buildProvider(t.app);
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");
    const { bytes, values } = await buildCertificatePdf({ seed: 307 });
    const up = await uploadCertificate(admin, bytes);
    const sent = await admin.post("/api/credentials/coverages").send({
      documentId: up.document.id,
      credentials: coverageCodes.map((code) => ({ typeCode: code, fields: certificateFields(values, code) })),
    });
    const ids = (sent.body.credentials as { id: number; typeCode: string }[]).map((c) => c.id);

    const detail = await reviewer.get(`/api/credentials/${ids[0]}`);
    for (const id of ids.slice(0, 3))
      await reviewer.post(`/api/credentials/${id}/verify`).send({}).expect(200);
    await reviewer
      .post(`/api/credentials/${ids[3]}/return`)
      .send({ reason: "The employer's liability limits are cut off; send the full page." })
      .expect(200);

    expect(detail.body.sameDocument.map((c: { id: number }) => c.id).sort()).toEqual([...ids].sort());
    const rows = await Credential.findAll({ where: { companyId: company.id }, order: [["id", "ASC"]] });
    expect(rows.map((r) => r.state)).toEqual(["verified", "verified", "verified", "returned"]);
  });

  it("says where each value was read: a box on the page per field, each coverage's own policy number", async () => {
    const { admin } = await buildProvider(t.app);
    const { agent: reviewer } = await signedInAgent(t.app, "platform", "reviewer");
    const { bytes, values } = await buildCertificatePdf({ seed: 308 });
    const up = await uploadCertificate(admin, bytes);

    const boxes = up.certificate.coverages.map((c) => c.evidence.policyNumber?.box);
    const sent = await admin.post("/api/credentials/coverages").send({
      documentId: up.document.id,
      credentials: [{ typeCode: "auto_liability", fields: certificateFields(values, "auto_liability") }],
    });
    const detail = await reviewer.get(`/api/credentials/${sent.body.credentials[0].id}`);

    expect(boxes.every((box) => box !== undefined && box.page === 1 && box.x > 0 && box.x < 1)).toBe(true);
    // The rows are printed top to bottom in the order read, so each coverage's box sits below the one before.
    const tops = boxes.map((box) => box!.y);
    expect([...tops].sort((a, b) => a - b)).toEqual(tops);
    expect(up.certificate.coverages[0]!.evidence.policyNumber!.confidence).toBeGreaterThanOrEqual(0.6);
    expect(detail.body.evidence.policyNumber.box).toEqual(boxes[1]);
  });
});
