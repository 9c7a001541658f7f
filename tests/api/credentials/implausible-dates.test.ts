import { describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { sequelize, useTestApp } from "../../support/test-app.ts";
import { buildProvider } from "../../support/build-provider.ts";
import { buildCertificatePdf } from "../../fixtures/build-certificate-pdf.ts";
import { certificateFields } from "../../support/submit-credential.ts";

const t = useTestApp();

async function uploadedCertificate(seed: number) {
  const { admin, company } = await buildProvider(t.app);
  const { bytes, values } = await buildCertificatePdf({ seed });
  const up = await admin
    .post("/api/documents")
    .field("typeCode", "general_liability")
    .attach("file", Buffer.from(bytes), "coi.pdf")
    .expect(201);
  return { admin, company, documentId: up.body.document.id as number, values };
}

async function credentialsOfDocument(documentId: number) {
  const rows = await sequelize().query<{ id: number }>("SELECT id FROM credentials WHERE document_id = $1", {
    bind: [documentId],
    type: QueryTypes.SELECT,
  });
  return rows.length;
}

describe("implausible document dates", () => {
  it.each([
    [
      { effectiveDate: "2026-06-01", expirationDate: "2026-05-31" },
      "body.fields.expirationDate",
      "before the effective date",
    ],
    [
      { effectiveDate: "2026-06-01", expirationDate: "0099-06-01" },
      "body.fields.expirationDate",
      "1950 to 2100",
    ],
    [
      { effectiveDate: "0000-01-01", expirationDate: "2027-01-01" },
      "body.fields.effectiveDate",
      "1950 to 2100",
    ],
    [
      { effectiveDate: "2026-06-01", expirationDate: "2999-06-01" },
      "body.fields.expirationDate",
      "1950 to 2100",
    ],
  ])("refuses %j with 422 naming %s and stores no credential", async (dates, path, words) => {
    const { admin, documentId, values } = await uploadedCertificate(31);

    const res = await admin.post("/api/credentials").send({
      documentId,
      typeCode: "general_liability",
      fields: { ...certificateFields(values, "general_liability"), ...dates },
    });

    expect(res.status).toBe(422);
    expect(res.body.error.fields[0].path).toBe(path);
    expect(res.body.error.fields[0].message).toContain(words);
    expect(await credentialsOfDocument(documentId)).toBe(0);
  });

  it("still accepts a policy that starts and ends on the same date, for the reviewer to question", async () => {
    const { admin, documentId, values } = await uploadedCertificate(32);

    const res = await admin.post("/api/credentials").send({
      documentId,
      typeCode: "general_liability",
      fields: {
        ...certificateFields(values, "general_liability"),
        effectiveDate: "2026-06-01",
        expirationDate: "2026-06-01",
      },
    });

    expect(res.status).toBe(201);
  });

  it("stores a lapse instant on the expiration date written on the certificate", async () => {
    const { admin, documentId, values } = await uploadedCertificate(33);

    const res = await admin.post("/api/credentials").send({
      documentId,
      typeCode: "general_liability",
      fields: {
        ...certificateFields(values, "general_liability"),
        effectiveDate: "2026-06-01",
        expirationDate: "2100-06-01",
      },
    });

    expect(res.status).toBe(201);
    expect(res.body.lapsesAt.slice(0, 10)).toBe("2100-06-01");
  });
});
