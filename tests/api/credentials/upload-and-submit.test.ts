import { describe, expect, it } from "vitest";
import request from "supertest";
import { useTestApp } from "../../support/test-app.ts";
import { buildProvider } from "../../support/build-provider.ts";
import { countStored } from "../../support/count-uploads.ts";
import { buildCertificatePdf } from "../../fixtures/build-certificate-pdf.ts";
import { certificateFields } from "../../support/submit-credential.ts";
import { buildTrainingCardPdf } from "../../fixtures/build-training-card.ts";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../../shared/api/error-body.ts";

const t = useTestApp();

describe("uploading a certificate of insurance", () => {
  it("stores the file and proposes the dates and limits written on it", async () => {
    const { admin } = await buildProvider(t.app);
    const { bytes, values } = await buildCertificatePdf({ seed: 7 });
    const expected = certificateFields(values, "general_liability");

    const res = await admin
      .post("/api/documents")
      .field("typeCode", "general_liability")
      .attach("file", Buffer.from(bytes), "certificate.pdf");

    expect(res.status).toBe(201);
    expect(res.body.extraction.method).toBe("pdf_text");
    expect(res.body.extraction.fields.effectiveDate).toBe(expected.effectiveDate);
    expect(res.body.extraction.fields.expirationDate).toBe(expected.expirationDate);
    expect(res.body.extraction.fields.limits.eachOccurrence).toBe(expected.limits.eachOccurrence);
    expect(res.body.extraction.found).toContain("policyNumber");
    expect(res.body.document.sha256).toMatch(/^[a-f0-9]{64}$/);
  });

  it("keeps one stored copy when the same file is uploaded twice", async () => {
    const { admin } = await buildProvider(t.app);
    const { bytes } = await buildCertificatePdf({ seed: 11 });
    await admin
      .post("/api/documents")
      .field("typeCode", "general_liability")
      .attach("file", Buffer.from(bytes), "a.pdf")
      .expect(201);
    const before = await countStored(t.config.UPLOADS_DIR);

    await admin
      .post("/api/documents")
      .field("typeCode", "auto_liability")
      .attach("file", Buffer.from(bytes), "b.pdf")
      .expect(201);
    const after = await countStored(t.config.UPLOADS_DIR);

    expect(after.documents).toBe(before.documents + 1);
    expect(after.stored).toBe(before.stored);
  });

  it("submits the checked fields as a credential awaiting verification", async () => {
    const { admin } = await buildProvider(t.app);
    const { bytes, values } = await buildCertificatePdf({ seed: 3 });
    const up = await admin
      .post("/api/documents")
      .field("typeCode", "general_liability")
      .attach("file", Buffer.from(bytes), "coi.pdf");

    const res = await admin.post("/api/credentials").send({
      documentId: up.body.document.id,
      typeCode: "general_liability",
      fields: certificateFields(values, "general_liability"),
    });

    expect(res.status).toBe(201);
    expect(res.body.state).toBe("submitted");
    expect(res.body.lapsesAt).not.toBeNull();
  });

  it("names each field that breaks its rule", async () => {
    const { admin } = await buildProvider(t.app);
    const { bytes } = await buildCertificatePdf({ seed: 4 });
    const up = await admin
      .post("/api/documents")
      .field("typeCode", "general_liability")
      .attach("file", Buffer.from(bytes), "coi.pdf");

    const res = await admin.post("/api/credentials").send({
      documentId: up.body.document.id,
      typeCode: "general_liability",
      fields: {
        insurerName: "",
        policyNumber: "X1",
        effectiveDate: "2026-02-30",
        expirationDate: "2027-01-01",
      },
    });

    expect(res.status).toBe(422);
    const paths = res.body.error.fields.map((f: { path: string }) => f.path);
    expect(paths).toEqual(expect.arrayContaining(["body.fields.insurerName", "body.fields.effectiveDate"]));
  });
});

describe("refusing bad files, leaving nothing behind", () => {
  const cases: [string, () => Promise<{ bytes: Buffer; name: string }>, number][] = [
    [
      "a PNG named .pdf (extension lies about the bytes)",
      async () => ({
        bytes: Buffer.from("89504e470d0a1a0a0000000d4948445200000001000000010806000000", "hex"),
        name: "card.pdf",
      }),
      415,
    ],
    [
      "an HTML page named .pdf",
      async () => ({ bytes: Buffer.from("<html><script>alert(1)</script></html>"), name: "coi.pdf" }),
      415,
    ],
    ["an empty file", async () => ({ bytes: Buffer.alloc(0), name: "empty.pdf" }), 422],
    [
      "a corrupt PDF",
      async () => ({
        bytes: Buffer.from("%PDF-1.7\n1 0 obj\n<< /Type /Catalog >>\ngarbage garbage\n%%EOF"),
        name: "broken.pdf",
      }),
      422,
    ],
    [
      "an 11 MB file",
      async () => ({
        bytes: Buffer.concat([Buffer.from("%PDF-1.7\n"), Buffer.alloc(11 * 1024 * 1024, 32)]),
        name: "huge.pdf",
      }),
      413,
    ],
  ];

  it.each(cases)(
    "answers %s with a clear error and stores no row and no file",
    async (_label, make, status) => {
      const { admin } = await buildProvider(t.app);
      const { bytes, name } = await make();
      const before = await countStored(t.config.UPLOADS_DIR);

      const res = await admin
        .post("/api/documents")
        .field("typeCode", "general_liability")
        .attach("file", bytes, name);
      const after = await countStored(t.config.UPLOADS_DIR);

      expect(res.status).toBe(status);
      expect(res.body.error.message.length).toBeGreaterThan(5);
      expect(after).toEqual(before);
    },
  );
});

describe("who may upload", () => {
  it("answers 401 to an anonymous upload", async () => {
    const res = await request(t.app)
      .post("/api/documents")
      .set(CSRF_HEADER, CSRF_HEADER_VALUE)
      .field("typeCode", "general_liability")
      .attach("file", Buffer.from("%PDF-1.4"), "x.pdf");

    expect(res.status).toBe(401);
  });

  it("lets a technician upload their own card but not another technician's", async () => {
    const mine = await buildProvider(t.app);
    const other = await buildProvider(t.app);
    const { bytes } = await buildTrainingCardPdf({ seed: 5 });

    const own = await mine.tech
      .post("/api/documents")
      .field("typeCode", "arc_flash")
      .attach("file", Buffer.from(bytes), "card.pdf");
    const foreign = await mine.tech
      .post("/api/documents")
      .field("typeCode", "arc_flash")
      .field("technicianId", String(other.technician.id))
      .attach("file", Buffer.from(bytes), "card.pdf");

    expect(own.status).toBe(201);
    expect(foreign.status).toBe(404);
  });
});
