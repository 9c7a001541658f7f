import { readdir } from "node:fs/promises";
import { tmpdir } from "node:os";
import { describe, expect, it } from "vitest";
import { extractDocument } from "../../../server/credentials/extraction/extract-document.ts";
import { DocumentUnreadableError, extractPdfText } from "../../../server/credentials/extraction/pdf-text.ts";
import { isOcrAvailable, ocrImage } from "../../../server/credentials/extraction/ocr.ts";
import { proposeFields } from "../../../shared/credentials/extract-fields.ts";
import {
  buildCertificatePdf,
  coverageCodes,
  expectedInsuranceFields,
  type CertificateValues,
} from "../../fixtures/build-certificate-pdf.ts";
import { buildScannedPdf } from "../../fixtures/build-scanned-pdf.ts";
import { buildCardPng } from "../../fixtures/build-training-card.ts";

const OCR_TEST_MS = 60_000;

function valueAt(fields: object, path: string): unknown {
  return path
    .split(".")
    .reduce<unknown>((value, key) => (value as Record<string, unknown> | undefined)?.[key], fields);
}

/** Fields right and fields present over every coverage row of one certificate's text. */
function score(values: CertificateValues, text: string) {
  let right = 0;
  let present = 0;
  const wrong: string[] = [];
  for (const code of coverageCodes) {
    const { fields } = proposeFields(code, "insurance", text);
    for (const [path, expected] of Object.entries(expectedInsuranceFields(values, code))) {
      present += 1;
      if (valueAt(fields, path) === expected) right += 1;
      else wrong.push(`${code}.${path}: ${String(valueAt(fields, path))} != ${String(expected)}`);
    }
  }
  return { right, present, wrong };
}

const ocrLeftovers = async () =>
  (await readdir(tmpdir())).filter((name) => name.startsWith("clearbench-ocr-"));

describe("reading a PDF's text layer", () => {
  it("refuses a 0-byte file as empty", async () => {
    const bytes = new Uint8Array(0);

    const reading = extractPdfText(bytes);

    await expect(reading).rejects.toMatchObject({ name: "DocumentUnreadableError", reason: "empty" });
  });

  it("refuses a damaged PDF as corrupt", async () => {
    const { bytes: good } = await buildCertificatePdf({ seed: 41 });
    const bytes = good.slice(0, 200);

    const reading = extractPdfText(bytes);

    await expect(reading).rejects.toMatchObject({ reason: "corrupt" });
  });

  it("refuses a file that is not a PDF at all as corrupt", async () => {
    const bytes = new TextEncoder().encode("hello, this is not a PDF");

    const reading = extractPdfText(bytes);

    await expect(reading).rejects.toBeInstanceOf(DocumentUnreadableError);
    await expect(reading).rejects.toMatchObject({ reason: "corrupt" });
  });

  it("stops reading at the time limit and says so", async () => {
    const { bytes } = await buildCertificatePdf({ seed: 42, pages: 2 });

    const started = Date.now();
    const reading = extractPdfText(bytes, { timeoutMs: 1 });

    await expect(reading).rejects.toMatchObject({ reason: "timeout" });
    expect(Date.now() - started).toBeLessThan(2_000);
  });

  it("reads no more pages than the page limit", async () => {
    const { bytes } = await buildCertificatePdf({ seed: 43, pages: 2 });

    const reading = await extractPdfText(bytes, { maxPages: 1 });

    expect(reading).toMatchObject({ pageCount: 2, pagesRead: 1 });
    expect(reading.text).not.toContain("continued from page 1");
  });
});

describe("extracting a document", () => {
  it("reads every field of generated certificates from their text layer", async () => {
    const results = [];
    for (const seed of [51, 52, 53, 54, 55, 56, 57, 58]) {
      const { bytes, values } = await buildCertificatePdf({
        seed,
        dateFormat: seed % 2 ? "MM/DD/YYYY" : "YYYY-MM-DD",
      });
      const extracted = await extractDocument({ bytes, mime: "application/pdf" });
      results.push({ method: extracted.method, ...score(values, extracted.text) });
    }

    const right = results.reduce((sum, r) => sum + r.right, 0);
    const present = results.reduce((sum, r) => sum + r.present, 0);

    process.stdout.write(`text-layer hit rate: ${right}/${present}\n`);
    expect(results.every((r) => r.method === "pdf_text")).toBe(true);
    expect(results.flatMap((r) => r.wrong)).toEqual([]);
  });

  it("reads a two-page certificate's text layer", async () => {
    const { bytes, values } = await buildCertificatePdf({ seed: 59, pages: 2 });

    const extracted = await extractDocument({
      bytes,
      mime: "application/pdf",
      credentialType: { code: "general_liability", fieldSet: "insurance" },
    });

    expect(extracted.proposal?.fields).toMatchObject({
      policyNumber: values.coverages.general_liability?.policyNumber,
    });
  });

  it(
    "reads scanned certificates through OCR: dates, policy numbers and limits",
    async () => {
      if (!(await isOcrAvailable()))
        throw new Error("tesseract and pdftoppm are expected at /usr/bin on this machine");
      const results = [];
      let twoPageMs = 0;
      for (const seed of [61, 62, 63]) {
        const { bytes, values } = await buildCertificatePdf({
          seed,
          pages: 2,
          dateFormat: seed % 2 ? "MM/DD/YYYY" : "YYYY-MM-DD",
        });
        const scanned = await buildScannedPdf(bytes);
        const started = performance.now();
        const extracted = await extractDocument({ bytes: scanned, mime: "application/pdf" });
        twoPageMs = Math.max(twoPageMs, performance.now() - started);
        results.push({ method: extracted.method, ...score(values, extracted.text) });
      }

      const right = results.reduce((sum, r) => sum + r.right, 0);
      const present = results.reduce((sum, r) => sum + r.present, 0);

      process.stdout.write(
        `OCR hit rate: ${right}/${present}; slowest two-page scan ${twoPageMs.toFixed(0)} ms; misses: ${results.flatMap((r) => r.wrong).join("; ")}\n`,
      );
      expect(results.every((r) => r.method === "ocr")).toBe(true);
      // OCR may misread a character or two, but most fields must come through exactly.
      expect(right / present).toBeGreaterThanOrEqual(0.9);
      expect(await ocrLeftovers()).toEqual([]);
    },
    OCR_TEST_MS,
  );

  it(
    "reads a photographed training card through OCR",
    async () => {
      const { bytes, values } = await buildCardPng({ seed: 71, dateFormat: "MM/DD/YYYY" });

      const extracted = await extractDocument({
        bytes,
        mime: "image/png",
        credentialType: { code: "lockout_tagout", fieldSet: "training" },
      });

      expect(extracted.method).toBe("ocr");
      expect(extracted.proposal?.fields).toMatchObject({
        issueDate: values.issueDate,
        expiryDate: values.expiryDate,
        cardNumber: values.cardNumber,
        holderName: values.holderName,
      });
    },
    OCR_TEST_MS,
  );

  it("says OCR is unavailable and proposes nothing when tesseract is missing", async () => {
    const { bytes } = await buildCardPng({ seed: 72 });

    const extracted = await extractDocument({
      bytes,
      mime: "image/png",
      ocr: { tesseractPath: "/nonexistent/tesseract" },
    });

    expect(extracted).toEqual({ text: "", method: "none", ocrAvailable: false, proposal: null });
  });

  it(
    "stops OCR at its time limit and leaves no temporary files",
    async () => {
      const { bytes } = await buildCardPng({ seed: 73 });

      const reading = ocrImage(bytes, { timeoutMs: 5 });

      await expect(reading).rejects.toMatchObject({ reason: "timeout" });
      expect(await ocrLeftovers()).toEqual([]);
    },
    OCR_TEST_MS,
  );
});
