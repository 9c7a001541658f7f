import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import {
  buildCertificatePdf,
  randomCertificateValues,
} from "../../server/db/demo-scenario/documents/build-certificate-pdf.ts";

const DAY_MS = 24 * 60 * 60 * 1000;
const isoDate = (at: Date) => at.toISOString().slice(0, 10);

/**
 * A certificate of insurance for the given insured whose general-liability row is in force today
 * (effective a month ago, expiring in eleven months), written to a temporary file for a file input.
 */
export async function writeCertificateFile(seed: number, insuredName: string, today = new Date()) {
  const values = randomCertificateValues(seed);
  const generalLiability = {
    ...values.coverages.general_liability!,
    effectiveDate: isoDate(new Date(today.getTime() - 30 * DAY_MS)),
    expirationDate: isoDate(new Date(today.getTime() + 335 * DAY_MS)),
  };
  const { bytes } = await buildCertificatePdf({
    seed,
    insured: { ...values.insured, name: insuredName },
    coverages: { ...values.coverages, general_liability: generalLiability },
  });
  const file = path.join(
    mkdtempSync(path.join(tmpdir(), "clearbench-certificate-")),
    `certificate-${seed}.pdf`,
  );
  writeFileSync(file, bytes);
  return { file, bytes, generalLiability };
}
