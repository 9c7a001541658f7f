import { PDFDocument, StandardFonts, rgb, type PDFFont, type PDFPage } from "pdf-lib";
import type { Limits } from "../../../../shared/credentials/credential-fields.ts";
import { formatDocumentDate, type DocumentDateFormat } from "../../../../shared/credentials/date-formats.ts";
import { buildSeededRandom, type SeededRandom } from "./build-seeded-random.ts";
import { demoNaic } from "../demo-naic.ts";

export const coverageCodes = [
  "general_liability",
  "auto_liability",
  "umbrella_liability",
  "workers_comp",
] as const;
export type CoverageCode = (typeof coverageCodes)[number];

export interface CertificateCoverage {
  insurerLetter: string;
  policyNumber: string;
  effectiveDate: string;
  expirationDate: string;
  additionalInsured: boolean;
  waiverOfSubrogation: boolean;
  limits: Limits;
  statutory?: boolean;
}

export interface CertificateValues {
  issueDate: string;
  producer: { name: string; lines: string[] };
  insured: { name: string; lines: string[] };
  insurers: { letter: string; name: string; naic: string }[];
  coverages: Partial<Record<CoverageCode, CertificateCoverage>>;
  holder: { name: string; lines: string[] };
  description: string[];
  dateFormat: DocumentDateFormat;
  // "y_n" prints Y or N in both flag columns; "x_blank" prints X for a flag and leaves the other blank.
  flagStyle: "y_n" | "x_blank";
  pages: 1 | 2;
}

const NAME_PARTS = [
  "Granite Ledger",
  "Northwind Harbor",
  "Copperfield",
  "Bluestem",
  "Ironvale",
  "Tallgrass",
  "Meridian Shoal",
  "Quillmoor",
];
const INSURER_KINDS = ["Mutual Insurance Co.", "Casualty Company", "Indemnity Corp.", "Assurance Company"];
const SHOPS = [
  "Kestrel Bend Machining Inc.",
  "Larkspur Precision Works LLC",
  "Hollow Pine Tool & Die Co.",
  "Redfern Spindle Shop Inc.",
];
const PROVIDERS = [
  "Brightline Spindle Services LLC",
  "Torvik Field Machine Repair Inc.",
  "Amberlode CNC Service Co.",
  "Sablecrest Machine Care LLC",
];
const AGENCIES = [
  "Harbor Ridge Insurance Agency",
  "Pinecrest Risk Partners",
  "Wexley & Dunmore Brokerage",
  "Calder Bay Insurance Group",
];
const STREETS = ["418 Quarry Lane", "77 Foundry Road", "1290 Millrace Ave", "35 Tinsmith Court"];
const TOWNS = [
  "Ashford Hollow, OH 44077",
  "Brennan Falls, WI 53119",
  "Cedar Mott, MI 48122",
  "Dunmere, IN 46580",
];

function addYear(iso: string): string {
  return `${Number(iso.slice(0, 4)) + 1}${iso.slice(4)}`;
}

function randomDate(random: SeededRandom): string {
  const month = String(random.int(1, 12)).padStart(2, "0");
  const day = String(random.int(1, 28)).padStart(2, "0");
  return `${random.int(2024, 2027)}-${month}-${day}`;
}

function randomPolicyNumber(random: SeededRandom, prefixes: string[]): string {
  return `${random.pick(prefixes)}-${random.int(1_000_000, 9_999_999)}${random.bool() ? "" : `-${random.int(10, 99)}`}`;
}

function randomCoverage(random: SeededRandom, code: CoverageCode, letter: string): CertificateCoverage {
  const effectiveDate = randomDate(random);
  const base = {
    insurerLetter: letter,
    effectiveDate,
    expirationDate: addYear(effectiveDate),
    additionalInsured: code !== "workers_comp" && random.bool(),
    waiverOfSubrogation: random.bool(),
  };
  if (code === "general_liability") {
    const eachOccurrence = random.pick([500_000, 1_000_000, 2_000_000]);
    const generalAggregate = eachOccurrence * random.pick([2, 3]);
    return {
      ...base,
      policyNumber: randomPolicyNumber(random, ["CGL", "GLP", "BPK"]),
      limits: {
        eachOccurrence,
        damageToRentedPremises: random.pick([50_000, 100_000, 300_000]),
        medicalExpense: random.pick([5_000, 10_000, 15_000]),
        personalAdvertisingInjury: eachOccurrence,
        generalAggregate,
        productsCompletedOpsAggregate: random.pick([generalAggregate, eachOccurrence * 2]),
      },
    };
  }
  if (code === "auto_liability") {
    return {
      ...base,
      policyNumber: randomPolicyNumber(random, ["BAU", "CAP"]),
      limits: { combinedSingleLimit: random.pick([500_000, 1_000_000, 2_000_000]) },
    };
  }
  if (code === "umbrella_liability") {
    const limit = random.pick([1_000_000, 2_000_000, 5_000_000, 10_000_000]);
    return {
      ...base,
      policyNumber: randomPolicyNumber(random, ["UMB", "XSL"]),
      limits: { umbrellaEachOccurrence: limit, umbrellaAggregate: limit },
    };
  }
  const [accident, employee, policy] = random.pick([
    [100_000, 100_000, 500_000],
    [500_000, 500_000, 500_000],
    [1_000_000, 1_000_000, 1_000_000],
  ] as const);
  return {
    ...base,
    policyNumber: randomPolicyNumber(random, ["WCE", "WKC"]),
    statutory: true,
    limits: {
      employersLiabilityEachAccident: accident,
      employersLiabilityDiseaseEachEmployee: employee,
      employersLiabilityDiseasePolicyLimit: policy,
    },
  };
}

/** Random but repeatable certificate values; the same seed gives the same certificate. */
export function randomCertificateValues(seed: number): CertificateValues {
  const random = buildSeededRandom(seed);
  const names = [...NAME_PARTS].sort(() => random.next() - 0.5);
  const insurers = ["A", "B", "C", "D"].map((letter, i) => ({
    letter,
    name: `${names[i]} ${random.pick(INSURER_KINDS)}`,
    naic: demoNaic(random.int(0, 99)),
  }));
  const letters = insurers.map((insurer) => insurer.letter);
  return {
    issueDate: randomDate(random),
    producer: { name: random.pick(AGENCIES), lines: [random.pick(STREETS), random.pick(TOWNS)] },
    insured: { name: random.pick(PROVIDERS), lines: [random.pick(STREETS), random.pick(TOWNS)] },
    insurers,
    coverages: Object.fromEntries(
      coverageCodes.map((code) => [code, randomCoverage(random, code, random.pick(letters))]),
    ),
    holder: { name: random.pick(SHOPS), lines: [random.pick(STREETS), random.pick(TOWNS)] },
    description: ["Field service, repair and calibration of CNC machine tools at the holder's premises."],
    dateFormat: random.bool() ? "MM/DD/YYYY" : "YYYY-MM-DD",
    flagStyle: "y_n",
    pages: 1,
  };
}

const money = (amount: number | undefined): string =>
  amount === undefined ? "" : `$ ${amount.toLocaleString("en-US")}`;

interface Pen {
  page: PDFPage;
  font: PDFFont;
  bold: PDFFont;
}

function write(pen: Pen, x: number, top: number, text: string, size = 7, bold = false): void {
  pen.page.drawText(text, { x, y: 792 - top, size, font: bold ? pen.bold : pen.font, color: rgb(0, 0, 0) });
}

function writeRight(pen: Pen, right: number, top: number, text: string, size = 7): void {
  write(pen, right - pen.font.widthOfTextAtSize(text, size), top, text, size);
}

function box(pen: Pen, x: number, top: number, width: number, height: number): void {
  pen.page.drawRectangle({
    x,
    y: 792 - top - height,
    width,
    height,
    borderColor: rgb(0, 0, 0),
    borderWidth: 0.6,
  });
}

const COLUMNS = {
  letter: 34,
  type: 50,
  addl: 186,
  subr: 208,
  policy: 230,
  eff: 318,
  exp: 368,
  label: 420,
  amountRight: 580,
};

interface RowLayout {
  code: CoverageCode;
  typeLines: string[];
  limitLines: [string, number | undefined][];
}

function rowLayouts(values: CertificateValues): RowLayout[] {
  const rows: RowLayout[] = [];
  const c = values.coverages;
  if (c.general_liability) {
    const l = c.general_liability.limits;
    rows.push({
      code: "general_liability",
      typeLines: [
        "COMMERCIAL GENERAL LIABILITY",
        "X  OCCURRENCE     CLAIMS-MADE",
        "AGGREGATE APPLIES PER:  X POLICY",
      ],
      limitLines: [
        ["EACH OCCURRENCE", l.eachOccurrence],
        ["RENTED PREMISES DAMAGE (each occ.)", l.damageToRentedPremises],
        ["MEDICAL EXPENSE (one person)", l.medicalExpense],
        ["PERSONAL & ADV INJURY", l.personalAdvertisingInjury],
        ["GENERAL AGGREGATE", l.generalAggregate],
        ["PRODUCTS-COMP/OP AGG", l.productsCompletedOpsAggregate],
      ],
    });
  }
  if (c.auto_liability) {
    rows.push({
      code: "auto_liability",
      typeLines: ["AUTOMOBILE LIABILITY", "X  ANY AUTO", "HIRED AND NON-OWNED AUTOS"],
      limitLines: [
        ["COMBINED SINGLE LIMIT (each accident)", c.auto_liability.limits.combinedSingleLimit],
        ["BODILY INJURY (per person)", undefined],
        ["PROPERTY DAMAGE (per accident)", undefined],
      ],
    });
  }
  if (c.umbrella_liability) {
    const l = c.umbrella_liability.limits;
    rows.push({
      code: "umbrella_liability",
      typeLines: ["UMBRELLA LIABILITY", "X  OCCURRENCE", "RETENTION  $ 10,000"],
      limitLines: [
        ["EACH OCCURRENCE", l.umbrellaEachOccurrence],
        ["AGGREGATE", l.umbrellaAggregate],
      ],
    });
  }
  if (c.workers_comp) {
    const l = c.workers_comp.limits;
    rows.push({
      code: "workers_comp",
      typeLines: ["WORKERS COMPENSATION AND", "EMPLOYERS' LIABILITY", "OWNER/OFFICER EXCLUDED?  N"],
      limitLines: [
        [c.workers_comp.statutory ? "X  PER STATUTE     OTHER" : "PER STATUTE     OTHER", undefined],
        ["E.L. EACH ACCIDENT", l.employersLiabilityEachAccident],
        ["E.L. DISEASE - EACH EMPLOYEE", l.employersLiabilityDiseaseEachEmployee],
        ["E.L. DISEASE - POLICY LIMIT", l.employersLiabilityDiseasePolicyLimit],
      ],
    });
  }
  return rows;
}

function flagText(style: CertificateValues["flagStyle"], on: boolean): string {
  if (style === "y_n") return on ? "Y" : "N";
  return on ? "X" : "";
}

function drawHeader(pen: Pen, values: CertificateValues): number {
  write(pen, 34, 40, "EVIDENCE OF LIABILITY COVERAGE", 13, true);
  write(pen, 470, 34, `ISSUED (${values.dateFormat})`, 6);
  write(pen, 470, 44, formatDocumentDate(values.issueDate, values.dateFormat), 8);
  const notice = [
    "This evidence of coverage is provided for information only. It gives the holder no rights and does not change, extend",
    "or replace the protection of the policies listed below. Where an insured must be added by endorsement, ask for the endorsement.",
  ];
  notice.forEach((line, i) => write(pen, 34, 58 + i * 8, line, 6));
  return 80;
}

function drawParties(pen: Pen, values: CertificateValues, top: number): number {
  box(pen, 30, top, 276, 150);
  box(pen, 306, top, 276, 150);
  write(pen, 34, top + 10, "PRODUCER", 6, true);
  [values.producer.name, ...values.producer.lines].forEach((line, i) =>
    write(pen, 34, top + 22 + i * 10, line, 8),
  );
  write(pen, 310, top + 10, "CONTACT:  Policy Service Desk", 7);
  write(pen, 310, top + 22, "PHONE:  (555) 014-2231", 7);
  write(pen, 310, top + 46, "INSURERS PROVIDING COVERAGE", 6, true);
  write(pen, 540, top + 46, "NAIC #", 6, true);
  write(pen, 34, top + 70, "INSURED", 6, true);
  [values.insured.name, ...values.insured.lines].forEach((line, i) =>
    write(pen, 34, top + 82 + i * 10, line, 8),
  );
  values.insurers.forEach((insurer, i) => {
    write(pen, 310, top + 58 + i * 12, `INSURER ${insurer.letter}:  ${insurer.name}`, 8);
    writeRight(pen, 578, top + 58 + i * 12, insurer.naic, 8);
  });
  return top + 150;
}

function drawCoverageTable(pen: Pen, values: CertificateValues, top: number): number {
  write(pen, 34, top + 10, "COVERAGES", 7, true);
  const headerTop = top + 16;
  box(pen, 30, headerTop, 552, 18);
  write(pen, COLUMNS.letter, headerTop + 8, "INSR", 5.5, true);
  write(pen, COLUMNS.letter, headerTop + 15, "LTR", 5.5, true);
  write(pen, COLUMNS.type, headerTop + 12, "TYPE OF INSURANCE", 6, true);
  write(pen, COLUMNS.addl, headerTop + 8, "ADDL", 5.5, true);
  write(pen, COLUMNS.addl, headerTop + 15, "INSD", 5.5, true);
  write(pen, COLUMNS.subr, headerTop + 8, "SUBR", 5.5, true);
  write(pen, COLUMNS.subr, headerTop + 15, "WVD", 5.5, true);
  write(pen, COLUMNS.policy, headerTop + 12, "POLICY NUMBER", 6, true);
  write(pen, COLUMNS.eff, headerTop + 8, "POLICY EFF", 5.5, true);
  write(pen, COLUMNS.exp, headerTop + 8, "POLICY EXP", 5.5, true);
  write(pen, COLUMNS.eff, headerTop + 15, values.dateFormat, 5.5, true);
  write(pen, COLUMNS.exp, headerTop + 15, values.dateFormat, 5.5, true);
  write(pen, COLUMNS.label, headerTop + 12, "LIMITS", 6, true);
  let rowTop = headerTop + 18;
  for (const row of rowLayouts(values)) {
    const coverage = values.coverages[row.code];
    if (!coverage) continue;
    const height = Math.max(row.typeLines.length, row.limitLines.length) * 11 + 4;
    box(pen, 30, rowTop, 552, height);
    const first = rowTop + 10;
    write(pen, COLUMNS.letter + 4, first, coverage.insurerLetter, 8);
    row.typeLines.forEach((line, i) => write(pen, COLUMNS.type, first + i * 11, line, 6.5));
    write(pen, COLUMNS.addl + 4, first, flagText(values.flagStyle, coverage.additionalInsured), 8);
    write(pen, COLUMNS.subr + 4, first, flagText(values.flagStyle, coverage.waiverOfSubrogation), 8);
    write(pen, COLUMNS.policy, first, coverage.policyNumber, 8);
    write(pen, COLUMNS.eff, first, formatDocumentDate(coverage.effectiveDate, values.dateFormat), 8);
    write(pen, COLUMNS.exp, first, formatDocumentDate(coverage.expirationDate, values.dateFormat), 8);
    row.limitLines.forEach(([label, amount], i) => {
      write(pen, COLUMNS.label, first + i * 11, label, 6.5);
      writeRight(pen, COLUMNS.amountRight, first + i * 11, money(amount), 8);
    });
    rowTop += height;
  }
  return rowTop;
}

function drawFooter(pen: Pen, values: CertificateValues, top: number): void {
  box(pen, 30, top, 552, 60);
  write(pen, 34, top + 10, "DESCRIPTION OF OPERATIONS / LOCATIONS / VEHICLES", 6, true);
  values.description.forEach((line, i) => write(pen, 34, top + 22 + i * 10, line, 7));
  if (values.pages === 2) write(pen, 34, top + 52, "Continued on the attached page.", 7);
  const holderTop = top + 70;
  box(pen, 30, holderTop, 276, 90);
  box(pen, 306, holderTop, 276, 90);
  write(pen, 34, holderTop + 10, "CERTIFICATE HOLDER", 6, true);
  write(pen, 310, holderTop + 10, "CANCELLATION", 6, true);
  [values.holder.name, ...values.holder.lines].forEach((line, i) =>
    write(pen, 34, holderTop + 26 + i * 10, line, 8),
  );
  const cancellation = [
    "If a policy above is canceled before its expiration date, notice",
    "will be given as the policy itself provides.",
  ];
  cancellation.forEach((line, i) => write(pen, 310, holderTop + 26 + i * 10, line, 7));
  write(pen, 310, holderTop + 66, "AUTHORIZED REPRESENTATIVE", 6, true);
  pen.page.drawLine({
    start: { x: 310, y: 792 - holderTop - 82 },
    end: { x: 570, y: 792 - holderTop - 82 },
    thickness: 0.5,
  });
  write(pen, 320, holderTop + 80, "M. Okonkwo-Reyes", 9);
}

function drawContinuation(pen: Pen, values: CertificateValues): void {
  write(pen, 34, 50, "ADDITIONAL REMARKS (continued from page 1)", 10, true);
  const lines = [
    `Insured: ${values.insured.name}`,
    "Work covered: preventive maintenance, spindle and axis repair, and machine moves inside the holder's plant.",
    "Coverage for the holder applies only as the policy endorsements provide.",
  ];
  lines.forEach((line, i) => write(pen, 34, 80 + i * 12, line, 8));
}

/** A one- or two-page certificate in the usual layout, with every value written returned for comparison. */
export async function buildCertificatePdf(overrides: Partial<CertificateValues> & { seed?: number } = {}) {
  const { seed = 1, ...rest } = overrides;
  const values: CertificateValues = { ...randomCertificateValues(seed), ...rest };
  const doc = await PDFDocument.create();
  const fonts = {
    font: await doc.embedFont(StandardFonts.Helvetica),
    bold: await doc.embedFont(StandardFonts.HelveticaBold),
  };
  const pen: Pen = { page: doc.addPage([612, 792]), ...fonts };
  const afterHeader = drawHeader(pen, values);
  const afterParties = drawParties(pen, values, afterHeader);
  const afterTable = drawCoverageTable(pen, values, afterParties + 4);
  drawFooter(pen, values, afterTable + 8);
  if (values.pages === 2) drawContinuation({ page: doc.addPage([612, 792]), ...fonts }, values);
  const bytes = await doc.save({ useObjectStreams: false });
  return { bytes: new Uint8Array(bytes), values };
}

/** The fields a reader should propose for one coverage row of a certificate built from these values. */
export function expectedInsuranceFields(
  values: CertificateValues,
  code: CoverageCode,
): Record<string, string | number | boolean> {
  const coverage = values.coverages[code];
  if (!coverage) return {};
  const insurer = values.insurers.find((candidate) => candidate.letter === coverage.insurerLetter);
  const expected: Record<string, string | number | boolean> = {
    namedInsured: values.insured.name,
    certificateHolder: values.holder.name,
    insurerName: insurer?.name ?? "",
    naic: insurer?.naic ?? "",
    policyNumber: coverage.policyNumber,
    effectiveDate: coverage.effectiveDate,
    expirationDate: coverage.expirationDate,
  };
  // A lone mark in one flag column cannot be placed from text alone, so it is expected only when both columns say something.
  const marks = [coverage.additionalInsured, coverage.waiverOfSubrogation].filter(Boolean).length;
  if (values.flagStyle === "y_n" || marks !== 1) {
    expected.additionalInsured = coverage.additionalInsured;
    expected.waiverOfSubrogation = coverage.waiverOfSubrogation;
  }
  if (coverage.statutory !== undefined) expected.statutory = coverage.statutory;
  for (const [name, amount] of Object.entries(coverage.limits)) {
    if (amount !== undefined) expected[`limits.${name}`] = amount;
  }
  return expected;
}
