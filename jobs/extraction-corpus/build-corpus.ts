import { createHash } from "node:crypto";
import { PDFDocument, StandardFonts, type PDFFont, type PDFPage } from "pdf-lib";
import {
  buildSeededRandom,
  type SeededRandom,
} from "../../server/db/demo-scenario/documents/build-seeded-random.ts";
import { documentDateFormats, formatDocumentDate } from "../../shared/credentials/date-formats.ts";

/**
 * A corpus of certificates and cards in layouts the reader's unit fixtures do not use: several layout modes, each
 * with its own label wordings, amount and date formats and fonts. Every company, person and insurer is invented;
 * NAIC codes start with 0, which no real company code does here (made up for the corpus).
 */

export type CoverageCode = "general_liability" | "auto_liability" | "umbrella_liability" | "workers_comp";
export interface CoverageTruth {
  code: CoverageCode;
  insurerName: string;
  naic: string;
  policyNumber: string;
  effectiveDate: string;
  expirationDate: string;
  limits: Record<string, number>;
  additionalInsured: boolean;
  waiverOfSubrogation: boolean;
}
export interface CertificateTruth {
  kind: "certificate";
  family: string;
  namedInsured: string;
  certificateHolder: string;
  coverages: CoverageTruth[];
}
export interface CardTruth {
  kind: "card";
  family: string;
  holderName: string;
  course: string;
  issueDate: string;
  expiryDate: string;
  cardNumber: string;
  trainer: string;
}
export interface CorpusDocument {
  id: string;
  seed: number;
  split: "tune" | "held_out";
  /** Which independently written producer made the document: pdf-lib drawing, or HTML printed by Chromium. */
  generator: "pdf-lib" | "chromium";
  bytes: Uint8Array;
  truth: CertificateTruth | CardTruth;
}

const CERT_MODES = ["stacked", "label_below", "two_column"] as const;
const CARD_MODES = ["colon", "label_below", "sentence", "two_column"] as const;

const WORDINGS = [
  {
    policy: "Policy No.",
    eff: "Effective",
    exp: "Expires",
    ai: "Additional insured",
    wos: "Waiver of subrogation",
  },
  { policy: "Policy number", eff: "Eff. date", exp: "Exp. date", ai: "Addl insd", wos: "Subr wvd" },
  {
    policy: "Pol #",
    eff: "Policy effective",
    exp: "Policy expiration",
    ai: "Additional Insured",
    wos: "Waiver of Subrogation",
  },
  { policy: "Policy #", eff: "Effective date", exp: "Expiration date", ai: "ADDL INSD", wos: "SUBR WVD" },
];
const HEADINGS: Record<CoverageCode, string[]> = {
  general_liability: ["General Liability", "Commercial General Liability"],
  auto_liability: ["Automobile Liability", "Auto Liability"],
  umbrella_liability: ["Umbrella Liability", "Excess Liability"],
  workers_comp: ["Workers Compensation", "Workers' Compensation and Employers' Liability"],
};
const LIMIT_WORDS: Record<string, string[]> = {
  eachOccurrence: ["Each occurrence", "Each Occurrence"],
  generalAggregate: ["General aggregate", "Gen'l aggregate"],
  combinedSingleLimit: ["Combined single limit", "Combined Single Limit (ea accident)"],
  umbrellaEachOccurrence: ["Each occurrence", "Each Occurrence"],
  umbrellaAggregate: ["Aggregate", "Aggregate"],
  employersLiabilityEachAccident: ["E.L. each accident", "E.L. Each Accident"],
};
const CARD_WORDINGS = [
  {
    name: "Name",
    course: "Course",
    issue: "Date of evaluation",
    expiry: "Re-evaluation due",
    number: "Card No",
    trainer: "Evaluator",
  },
  {
    name: "Participant",
    course: "Course title",
    issue: "Completed on",
    expiry: "Valid through",
    number: "Certificate #",
    trainer: "Instructor",
  },
];

export const FIRST = ["Odile", "Brannock", "Tamsin", "Heloise", "Corwin", "Ysolde", "Peregrine", "Maelis"];
export const LAST = [
  "Quarrington",
  "Vellacott",
  "Ashgrove",
  "Pendlebury",
  "Morrowind",
  "Thistlewood",
  "Carrack",
];
export const FIRMS = ["Lanternfield", "Oxbow Reach", "Saltmarsh", "Wrenfold", "Cobblestone", "Harrowgate"];
export const INSURER_KINDS = [
  "Mutual Casualty Co.",
  "Indemnity Company",
  "Assurance Corp.",
  "Fire & Casualty Co.",
];
export const COURSES = [
  "Control of Hazardous Energy (Lockout/Tagout)",
  "Powered Industrial Truck Operator Evaluation",
  "Electrical Safety and Arc Flash Awareness",
  "Confined Space Entrant and Attendant",
];

export const hashSplit = (id: string): "tune" | "held_out" =>
  createHash("sha256").update(id).digest()[0]! % 10 < 4 ? "held_out" : "tune";

export function date(random: SeededRandom, fromYear: number): string {
  return `${random.int(fromYear, fromYear + 1)}-${String(random.int(1, 12)).padStart(2, "0")}-${String(random.int(1, 28)).padStart(2, "0")}`;
}
const nextYear = (iso: string) => `${Number(iso.slice(0, 4)) + 1}${iso.slice(4)}`;

function amountText(random: SeededRandom, amount: number): string {
  const style = random.int(0, 3);
  if (style === 0) return `$${amount.toLocaleString("en-US")}`;
  if (style === 1) return amount.toLocaleString("en-US");
  if (amount % 1_000_000 === 0) return style === 2 ? `$${amount / 1_000_000}M` : `${amount / 1_000_000}MM`;
  return `$${amount.toLocaleString("en-US")}.00`;
}

export function coverageTruth(random: SeededRandom, code: CoverageCode): CoverageTruth {
  const effectiveDate = date(random, 2026);
  const million = random.pick([1, 2]) * 1_000_000;
  const limits: Record<string, number> =
    code === "general_liability"
      ? { eachOccurrence: million, generalAggregate: million * 2 }
      : code === "auto_liability"
        ? { combinedSingleLimit: million }
        : code === "umbrella_liability"
          ? { umbrellaEachOccurrence: million * 2, umbrellaAggregate: million * 2 }
          : { employersLiabilityEachAccident: random.pick([500_000, 1_000_000]) };
  const prefix = {
    general_liability: "GL",
    auto_liability: "CA",
    umbrella_liability: "UX",
    workers_comp: "WC",
  }[code];
  return {
    code,
    insurerName: `${random.pick(FIRMS)} ${random.pick(INSURER_KINDS)}`,
    naic: `0${random.int(1000, 9999)}`,
    policyNumber: random.bool()
      ? `${prefix}-${random.int(100000, 999999)}`
      : `${prefix} ${random.int(100, 999)} ${random.int(1000, 9999)}`,
    effectiveDate,
    expirationDate: nextYear(effectiveDate),
    limits,
    additionalInsured: code !== "workers_comp" && random.bool(),
    waiverOfSubrogation: random.bool(),
  };
}

interface Pen {
  page: PDFPage;
  font: PDFFont;
  size: number;
  top: number;
}
const line = (pen: Pen, x: number, text: string) => {
  pen.page.drawText(text, { x, y: 792 - pen.top, size: pen.size, font: pen.font });
};

async function certificatePdf(seed: number, mode: (typeof CERT_MODES)[number], wording: number) {
  const random = buildSeededRandom(seed);
  const words = WORDINGS[wording]!;
  const dateFormat = random.pick(documentDateFormats);
  const codes = (
    ["general_liability", "auto_liability", "umbrella_liability", "workers_comp"] as const
  ).filter(() => random.next() < 0.8);
  const truth: CertificateTruth = {
    kind: "certificate",
    family: `certificate/${mode}/${wording}`,
    namedInsured: `${random.pick(FIRMS)} Machine Service ${random.pick(["LLC", "Inc.", "Co."])}`,
    certificateHolder: `${random.pick(FIRMS)} Precision Works ${random.pick(["LLC", "Inc."])}`,
    coverages: (codes.length ? codes : (["general_liability"] as const)).map((code) =>
      coverageTruth(random, code),
    ),
  };
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(
    random.pick([StandardFonts.Helvetica, StandardFonts.TimesRoman, StandardFonts.Courier]),
  );
  let pen: Pen = { page: doc.addPage([612, 792]), font, size: random.pick([8, 9, 10]), top: 50 };
  const step = () => {
    pen.top += pen.size + 5;
    if (pen.top > 740) pen = { ...pen, page: doc.addPage([612, 792]), top: 50 };
  };
  const valueX = random.pick([200, 240, 300]);
  const field = (label: string, value: string) => {
    if (mode === "stacked") line(pen, 40, `${label}: ${value}`);
    else if (mode === "two_column") {
      line(pen, 40, label);
      line(pen, valueX, value);
    } else {
      line(pen, 40, label);
      step();
      line(pen, 40, value);
    }
    step();
  };
  const fmt = (iso: string) => formatDocumentDate(iso, dateFormat);
  line(pen, 40, "EVIDENCE OF INSURANCE");
  step();
  step();
  field("Named insured", truth.namedInsured);
  line(
    pen,
    40,
    `${random.int(10, 999)} ${random.pick(["Quarry", "Foundry", "Lathe"])} Road, ${random.pick(["Ashmoor", "Dunlin Cross"])}, OH 4${random.int(1000, 9999)}`,
  );
  step();
  step();
  line(pen, 40, "COVERAGES");
  step();
  for (const coverage of truth.coverages) {
    line(pen, 40, random.pick(HEADINGS[coverage.code]).toUpperCase());
    step();
    field("Insurer", `${coverage.insurerName} (NAIC ${coverage.naic})`);
    field(words.policy, coverage.policyNumber);
    field(words.eff, fmt(coverage.effectiveDate));
    field(words.exp, fmt(coverage.expirationDate));
    for (const [name, amount] of Object.entries(coverage.limits)) {
      field(random.pick(LIMIT_WORDS[name]!), amountText(random, amount));
    }
    field(words.ai, coverage.additionalInsured ? "Y" : "N");
    field(words.wos, coverage.waiverOfSubrogation ? "Y" : "N");
    step();
  }
  line(pen, 40, "DESCRIPTION OF OPERATIONS");
  step();
  line(pen, 40, "Field service of CNC machine tools.");
  step();
  step();
  field("Certificate holder", truth.certificateHolder);
  return { bytes: new Uint8Array(await doc.save()), truth };
}

async function cardPdf(seed: number, mode: (typeof CARD_MODES)[number], wording: number) {
  const random = buildSeededRandom(seed);
  const words = CARD_WORDINGS[wording]!;
  const dateFormat = random.pick(documentDateFormats);
  const issueDate = date(random, 2025);
  const truth: CardTruth = {
    kind: "card",
    family: `card/${mode}/${wording}`,
    holderName: `${random.pick(FIRST)} ${random.pick(LAST)}`,
    course: random.pick(COURSES),
    issueDate,
    expiryDate: `${Number(issueDate.slice(0, 4)) + random.int(1, 3)}${issueDate.slice(4)}`,
    cardNumber: `${random.pick(["TC", "EV", "SC"])}-${random.int(10000, 99999)}`,
    trainer: `${random.pick(FIRST)} ${random.pick(LAST)}`,
  };
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(random.pick([StandardFonts.Helvetica, StandardFonts.TimesRoman]));
  const pen: Pen = { page: doc.addPage([360, 240]), font, size: 9, top: 30 };
  const put = (x: number, text: string) =>
    pen.page.drawText(text, { x, y: 240 - pen.top, size: pen.size, font });
  const step = () => (pen.top += 14);
  const fmt = (iso: string) => formatDocumentDate(iso, dateFormat);
  put(20, random.pick(["SAFETY TRAINING RECORD", "CERTIFICATE OF COMPLETION", "OPERATOR CARD"]));
  step();
  const field = (label: string, value: string) => {
    if (mode === "label_below") {
      put(20, label);
      step();
      put(20, value);
    } else if (mode === "two_column") {
      put(20, label);
      put(150, value);
    } else put(20, `${label}: ${value}`);
    step();
  };
  if (mode === "sentence") {
    put(20, `This certifies that ${truth.holderName} has successfully completed`);
    step();
    put(20, `${truth.course}.`);
    step();
    put(20, `${words.issue} ${fmt(truth.issueDate)}     ${words.expiry} ${fmt(truth.expiryDate)}`);
    step();
  } else {
    field(words.name, truth.holderName);
    field(words.course, truth.course);
    field(words.issue, fmt(truth.issueDate));
    field(words.expiry, fmt(truth.expiryDate));
  }
  field(words.number, truth.cardNumber);
  field(words.trainer, truth.trainer);
  return { bytes: new Uint8Array(await doc.save()), truth };
}

/** Every document of the corpus, each with the values printed on it and its split, chosen by a hash of its id. */
export async function buildCorpus(perFamily = 4): Promise<CorpusDocument[]> {
  const documents: CorpusDocument[] = [];
  let seed = 9000;
  for (const mode of CERT_MODES) {
    for (let wording = 0; wording < WORDINGS.length; wording += 1) {
      for (let n = 0; n < perFamily; n += 1) {
        seed += 1;
        const { bytes, truth } = await certificatePdf(seed, mode, wording);
        const id = `${truth.family}/${seed}`;
        documents.push({ id, seed, split: hashSplit(id), generator: "pdf-lib", bytes, truth });
      }
    }
  }
  for (const mode of CARD_MODES) {
    for (let wording = 0; wording < CARD_WORDINGS.length; wording += 1) {
      for (let n = 0; n < perFamily; n += 1) {
        seed += 1;
        const { bytes, truth } = await cardPdf(seed, mode, wording);
        const id = `${truth.family}/${seed}`;
        documents.push({ id, seed, split: hashSplit(id), generator: "pdf-lib", bytes, truth });
      }
    }
  }
  return documents;
}
