import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import {
  buildCertificatePdf,
  randomCertificateValues,
  type CertificateValues,
} from "../../server/db/demo-scenario/documents/build-certificate-pdf.ts";

const DAY_MS = 24 * 60 * 60 * 1000;
const isoDate = (at: Date) => at.toISOString().slice(0, 10);

/**
 * A certificate of insurance for the given insured whose general-liability row is in force today
 * (effective a month ago, expiring in eleven months), written to a temporary file for a file input.
 */
export async function writeCertificateFile(
  seed: number,
  insuredName: string,
  today = new Date(),
  { everyCoverageInForce = false } = {},
) {
  const values = randomCertificateValues(seed);
  const inForce = {
    effectiveDate: isoDate(new Date(today.getTime() - 30 * DAY_MS)),
    expirationDate: isoDate(new Date(today.getTime() + 335 * DAY_MS)),
  };
  const generalLiability = { ...values.coverages.general_liability!, ...inForce };
  const coverages = everyCoverageInForce
    ? Object.fromEntries(Object.entries(values.coverages).map(([code, c]) => [code, { ...c!, ...inForce }]))
    : values.coverages;
  const { bytes } = await buildCertificatePdf({
    seed,
    insured: { ...values.insured, name: insuredName },
    coverages: { ...coverages, general_liability: generalLiability },
  });
  const file = path.join(
    mkdtempSync(path.join(tmpdir(), "clearbench-certificate-")),
    `certificate-${seed}.pdf`,
  );
  writeFileSync(file, bytes);
  const printed: CertificateValues["coverages"] = { ...coverages, general_liability: generalLiability };
  return { file, bytes, generalLiability, coverages: printed };
}
