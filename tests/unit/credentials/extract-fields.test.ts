import { describe, expect, it } from "vitest";
import { parseAmount, proposeFields, readCertificate } from "../../../shared/credentials/extract-fields.ts";
import { extractPdfText } from "../../../server/credentials/extraction/pdf-text.ts";
import {
  buildCertificatePdf,
  coverageCodes,
  expectedInsuranceFields,
} from "../../fixtures/build-certificate-pdf.ts";
import { buildTrainingCardPdf } from "../../fixtures/build-training-card.ts";
import type { DocumentDateFormat } from "../../../shared/credentials/date-formats.ts";

const DATE_FORMATS: DocumentDateFormat[] = ["MM/DD/YYYY", "YYYY-MM-DD", "M/D/YY"];

function valueAt(fields: object, path: string): unknown {
  return path
    .split(".")
    .reduce<unknown>((value, key) => (value as Record<string, unknown> | undefined)?.[key], fields);
}

describe("proposing certificate fields from a PDF's text", () => {
  for (const seed of [11, 12, 13, 14, 15, 16, 17, 18, 19]) {
    const dateFormat = DATE_FORMATS[seed % 3] ?? "MM/DD/YYYY";
    it(`reads every written date, limit, number and flag of each coverage (seed ${seed}, ${dateFormat})`, async () => {
      const { bytes, values } = await buildCertificatePdf({ seed, dateFormat });
      const { text } = await extractPdfText(bytes);

      const proposals = coverageCodes.map((code) => ({
        code,
        proposal: proposeFields(code, "insurance", text),
      }));

      for (const { code, proposal } of proposals) {
        const expected = expectedInsuranceFields(values, code);
        const read = Object.fromEntries(
          Object.keys(expected).map((path) => [path, valueAt(proposal.fields, path)]),
        );
        expect(read, code).toEqual(expected);
        expect([...proposal.found].sort(), code).toEqual(Object.keys(expected).sort());
      }
    });
  }

  it("reads marks printed as X with the other column blank when both or neither are marked", async () => {
    const base = await buildCertificatePdf({ seed: 21 });
    const gl = base.values.coverages.general_liability;
    const auto = base.values.coverages.auto_liability;
    if (!gl || !auto) throw new Error("fixture lost a coverage");
    const { bytes } = await buildCertificatePdf({
      seed: 21,
      flagStyle: "x_blank",
      coverages: {
        general_liability: { ...gl, additionalInsured: true, waiverOfSubrogation: true },
        auto_liability: { ...auto, additionalInsured: false, waiverOfSubrogation: false },
      },
    });
    const { text } = await extractPdfText(bytes);

    const glFields = proposeFields("general_liability", "insurance", text).fields;
    const autoFields = proposeFields("auto_liability", "insurance", text).fields;

    expect([glFields.additionalInsured, glFields.waiverOfSubrogation]).toEqual([true, true]);
    expect([autoFields.additionalInsured, autoFields.waiverOfSubrogation]).toEqual([false, false]);
  });

  it("leaves a lone X for the reviewer, since text alone cannot say which column it sits in", async () => {
    const base = await buildCertificatePdf({ seed: 22 });
    const gl = base.values.coverages.general_liability;
    if (!gl) throw new Error("fixture lost a coverage");
    const { bytes } = await buildCertificatePdf({
      seed: 22,
      flagStyle: "x_blank",
      coverages: { general_liability: { ...gl, additionalInsured: true, waiverOfSubrogation: false } },
    });
    const { text } = await extractPdfText(bytes);

    const proposal = proposeFields("general_liability", "insurance", text);

    expect(proposal.found).not.toContain("additionalInsured");
    expect(proposal.found).not.toContain("waiverOfSubrogation");
    expect(proposal.found).toContain("policyNumber");
  });

  it("reads the producer, the insurers with their NAIC codes and the certificate holder", async () => {
    const { bytes, values } = await buildCertificatePdf({ seed: 23 });
    const { text } = await extractPdfText(bytes);

    const reading = readCertificate(text);

    expect(reading.producer).toBe(values.producer.name);
    expect(reading.insurers).toEqual(values.insurers);
    expect(reading.certificateHolder).toBe(values.holder.name);
  });

  it("proposes only the names for a coverage the certificate does not list", async () => {
    const { bytes } = await buildCertificatePdf({ seed: 24, coverages: {} });
    const { text } = await extractPdfText(bytes);

    const proposal = proposeFields("umbrella_liability", "insurance", text);

    expect(proposal.found.sort()).toEqual(["certificateHolder", "namedInsured"]);
  });
});

describe("reading OCR-like text", () => {
  it("reads amounts with periods, stray spaces, a missing dollar sign and the letter O for zero", () => {
    const fragments = ["$ 1.000.000", "$1, 000,000", " 2,0O0,000", "}2,000,000", "  $ 5,000"];

    const amounts = fragments.map(parseAmount);

    expect(amounts).toEqual([1_000_000, 1_000_000, 2_000_000, 2_000_000, 5_000]);
  });

  it("reads millions written as $1M, 1MM, $2MM and amounts with cents", () => {
    const fragments = ["$1M", "1MM", "$2MM", "$1.5M", "$ 5 million", "1,000,000.00", "$500K", "1000000"];

    const amounts = fragments.map((fragment) => parseAmount(fragment));

    expect(amounts).toEqual([
      1_000_000, 1_000_000, 2_000_000, 1_500_000, 5_000_000, 1_000_000, 500_000, 1_000_000,
    ]);
  });

  it("reads a table printed with thousands omitted as whole dollars", () => {
    const text = [
      "INSURER A:  Tallgrass Indemnity Corp.   31905",
      "TYPE OF INSURANCE                                        LIMITS (000s omitted)",
      "A  GENERAL LIABILITY   Y  N  GLP-4410023   01/15/2026  01/15/2027   EACH OCCURRENCE  $ 1,000",
      "                                                                   GENERAL AGGREGATE  $ 2,000",
      "A  UMBRELLA LIABILITY  N  N  UMB-7730021   01/15/2026  01/15/2027   EACH OCCURRENCE  $2M",
      "DESCRIPTION OF OPERATIONS",
    ].join("\n");

    const gl = proposeFields("general_liability", "insurance", text).fields;
    const umbrella = proposeFields("umbrella_liability", "insurance", text).fields;

    expect(gl.limits).toEqual({ eachOccurrence: 1_000_000, generalAggregate: 2_000_000 });
    expect(umbrella.limits).toEqual({ umbrellaEachOccurrence: 2_000_000 });
  });

  it("reads a coverage row whose columns OCR put on one line with noise between them", () => {
    const text = [
      "INSURER B:  Quillmoor Casualty Company          4O512",
      "TYPE OF INSURANCE",
      "B_ COMMERCIAL GENERAL LIABILITY     Y  —  N   CGL-7781203     O1/15/2026  01/15/2O27  EACH OCCURRENCE        $1.000.000",
      "X OCCURRENCE CLAIMS-MADE                          RENTED PREMISES DAMAGE (each occ.}$ 100,000",
      "GENERAL AGGREGATE   $ 2,000, 000",
      "C WORKERS COMPENSATION AND   N  Y  WKC-1180422   2026-02-01  2027-02-01  xX PERSTATUTE OTHER",
      "ELL. DISEASE - EACH EMPLOYEE —$ 500,000",
      "DESCRIPTION OF OPERATIONS",
    ].join("\n");

    const gl = proposeFields("general_liability", "insurance", text).fields;
    const wc = proposeFields("workers_comp", "insurance", text).fields;

    expect(gl).toMatchObject({
      insurerName: "Quillmoor Casualty Company",
      naic: "40512",
      policyNumber: "CGL-7781203",
      effectiveDate: "2026-01-15",
      expirationDate: "2027-01-15",
      additionalInsured: true,
      waiverOfSubrogation: false,
      limits: { eachOccurrence: 1_000_000, damageToRentedPremises: 100_000, generalAggregate: 2_000_000 },
    });
    expect(wc).toMatchObject({ policyNumber: "WKC-1180422", statutory: true, waiverOfSubrogation: true });
    expect(wc.limits).toEqual({ employersLiabilityDiseaseEachEmployee: 500_000 });
  });
});

describe("proposing training card fields", () => {
  for (const seed of [31, 32, 33, 34, 35, 36]) {
    it(`reads the holder, course, dates, card number and trainer (seed ${seed})`, async () => {
      const { bytes, values } = await buildTrainingCardPdf({
        seed,
        dateFormat: DATE_FORMATS[seed % 3] ?? "MM/DD/YYYY",
      });
      const { text } = await extractPdfText(bytes);

      const proposal = proposeFields("lockout_tagout", "training", text);

      expect(proposal.fields).toEqual({
        holderName: values.holderName,
        course: values.course,
        issueDate: values.issueDate,
        expiryDate: values.expiryDate,
        cardNumber: values.cardNumber,
        trainer: values.trainer,
      });
    });
  }

  it("reads the builder, control family and level of machine-builder training", async () => {
    const { bytes, values } = await buildTrainingCardPdf({ seed: 37, kind: "oem" });
    const { text } = await extractPdfText(bytes);

    const proposal = proposeFields("oem_service", "oem", text);

    expect(proposal.fields).toMatchObject({
      ...values.oem,
      holderName: values.holderName,
      issueDate: values.issueDate,
    });
  });

  it("leaves out a card without an expiry date rather than guessing one", async () => {
    const { bytes } = await buildTrainingCardPdf({ seed: 38, expiryDate: undefined });
    const { text } = await extractPdfText(bytes);

    const proposal = proposeFields("first_aid_cpr", "training", text);

    expect(proposal.found).not.toContain("expiryDate");
    expect(proposal.found).toContain("issueDate");
  });

  // Common practice on wallet cards: labels printed without a colon, one space before the value.
  it("reads a card number and trainer joined to their labels by one space, but not a sentence", () => {
    const text =
      "Qualified Operator\nThis certifies that Tamsin Quarrington has\ncompleted Forklift Evaluation.\nIssued 3/21/26\nID No. QW-81551\nTrainer Brannock Thistlewood\nCard number pending renewal";

    const proposal = proposeFields("lockout_tagout", "training", text);

    expect(proposal.fields.cardNumber).toBe("QW-81551");
    expect(proposal.fields.trainer).toBe("Brannock Thistlewood");

    const noNumber = proposeFields(
      "lockout_tagout",
      "training",
      "Card number pending renewal\nTrainer was absent",
    );
    expect(noNumber.found).not.toContain("cardNumber");
    expect(noNumber.found).not.toContain("trainer");
  });

  it("reads a course under its label even when the title opens with another label's word", () => {
    const text =
      "Participant\nYsolde Ashgrove\nTraining\nControl of Hazardous Energy (Lockout/Tagout)\nCertificate No.\nQW-94628";

    const proposal = proposeFields("lockout_tagout", "training", text);

    expect(proposal.fields.course).toBe("Control of Hazardous Energy (Lockout/Tagout)");
    expect(proposal.fields.cardNumber).toBe("QW-94628");
  });

  it("reads a license's number and issuing authority", () => {
    const text =
      "STATE BOARD OF ELECTRICAL EXAMINERS\nLicensee: Priya Halloran\nLicense No: EL-55102\nIssued by: Board of Electrical Examiners\nIssue Date: 04/02/2025   Expires: 04/01/2027";

    const proposal = proposeFields("electrical_license", "license", text);

    expect(proposal.fields).toEqual({
      holderName: "Priya Halloran",
      licenseNumber: "EL-55102",
      issuingAuthority: "Board of Electrical Examiners",
      issueDate: "2025-04-02",
      expiryDate: "2027-04-01",
    });
  });
});
