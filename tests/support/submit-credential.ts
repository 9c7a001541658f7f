import type request from "supertest";
import {
  buildCertificatePdf,
  type CertificateValues,
  type CoverageCode,
} from "../fixtures/build-certificate-pdf.ts";

type TestAgent = ReturnType<typeof request.agent>;

/** The fields of one coverage line exactly as the generated certificate prints them, nested as the API takes them. */
export function certificateFields(values: CertificateValues, code: CoverageCode) {
  const coverage = values.coverages[code]!;
  const insurer = values.insurers.find((i) => i.letter === coverage.insurerLetter);
  return {
    insurerName: insurer?.name ?? "Unnamed insurer",
    naic: insurer?.naic,
    policyNumber: coverage.policyNumber,
    namedInsured: values.insured.name,
    certificateHolder: values.holder.name,
    effectiveDate: coverage.effectiveDate,
    expirationDate: coverage.expirationDate,
    limits: coverage.limits,
    additionalInsured: coverage.additionalInsured,
    waiverOfSubrogation: coverage.waiverOfSubrogation,
    ...(coverage.statutory !== undefined ? { statutory: coverage.statutory } : {}),
  };
}

/** Uploads a generated certificate and submits its general-liability line; returns the credential. */
export async function submitLiabilityCertificate(
  agent: TestAgent,
  seed: number,
  overrides: Record<string, unknown> = {},
) {
  const { bytes, values } = await buildCertificatePdf({ seed });
  const up = await agent
    .post("/api/documents")
    .field("typeCode", "general_liability")
    .attach("file", Buffer.from(bytes), `coi-${seed}.pdf`);
  if (up.status !== 201) throw new Error(`upload failed: ${up.status} ${JSON.stringify(up.body)}`);
  const fields = { ...certificateFields(values, "general_liability"), ...overrides };
  const res = await agent
    .post("/api/credentials")
    .send({ documentId: up.body.document.id, typeCode: "general_liability", fields });
  if (res.status !== 201) throw new Error(`submit failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as { id: number; documentId: number; state: string };
}
