import type {
  ExemptionFields,
  FieldSet,
  InsuranceFields,
  LicenseFields,
  LimitName,
  Limits,
  OemFields,
  TrainingFields,
} from "./credential-fields.ts";
import {
  DATE_IN_TEXT,
  MONTH_IN_TEXT,
  findDocumentDates,
  parseDocumentDate,
  parseDocumentEndDate,
} from "./date-formats.ts";
import { LIMIT_LINES_BY_COVERAGE } from "./limit-lines.ts";

/**
 * Reads proposed fields out of a document's text (a PDF text layer or OCR output). Everything here is a
 * proposal the uploader corrects and a reviewer verifies, so a field we are unsure of is left out rather than guessed.
 */

export const insuranceCoverageCodes = [
  "general_liability",
  "auto_liability",
  "umbrella_liability",
  "workers_comp",
] as const;
export type InsuranceCoverageCode = (typeof insuranceCoverageCodes)[number];

interface FieldsBySet {
  insurance: InsuranceFields;
  training: TrainingFields;
  oem: OemFields;
  license: LicenseFields;
  exemption: ExemptionFields;
}
export interface FieldProposal<S extends FieldSet = FieldSet> {
  fields: Partial<FieldsBySet[S]>;
  /** Paths of the fields read from the document, e.g. "policyNumber", "limits.eachOccurrence". */
  found: string[];
}

export interface CoverageReading {
  insurerLetter?: string;
  /** Printed inside the coverage's own block ("Insurer: ...", "NAIC 12345") rather than by letter. */
  insurerName?: string;
  naic?: string;
  policyNumber?: string;
  effectiveDate?: string;
  expirationDate?: string;
  limits: Limits;
  additionalInsured?: boolean;
  waiverOfSubrogation?: boolean;
  statutory?: boolean;
}
export interface CertificateReading {
  producer?: string;
  namedInsured?: string;
  certificateHolder?: string;
  insurers: { letter: string; name: string; naic?: string }[];
  coverages: Partial<Record<InsuranceCoverageCode, CoverageReading>>;
}

const COVERAGE_MARKERS: Record<InsuranceCoverageCode, RegExp> = {
  general_liability: /(?:COMMERCIAL\s+)?GENERAL\s+LIAB|\bCGL\b/i,
  auto_liability: /AUTO(?:MOBILE)?\s+LIAB/i,
  umbrella_liability: /UMBRELLA\s+LIAB|EXCESS\s+LIAB/i,
  workers_comp: /WORKERS\s*'?\s*COMP/i,
};

// "(each occ.)" after rented premises is part of another label, hence the look-behind.
const EACH_OCCURRENCE = /(?<!\(\s*)\bEACH\s*OCC(?:URRENCE|\.)?/i;
// How each limit line's label may be printed; which lines a coverage prints comes from LIMIT_LINES_BY_COVERAGE.
const LIMIT_PATTERNS: Record<LimitName, RegExp> = {
  eachOccurrence: EACH_OCCURRENCE,
  damageToRentedPremises: /(?:DAMAGE\s+TO\s+)?RENTED\s+PREMISES/i,
  medicalExpense: /MED(?:ICAL)?\.?\s*EXP(?:ENSE)?/i,
  personalAdvertisingInjury: /PERSONAL\s*(?:&|AND)?\s*ADV(?:ERTISING)?\.?\s*INJ(?:URY)?/i,
  generalAggregate: /GEN(?:ERAL|'L)?\.?\s*AGG(?:REGATE)?(?!\s*LIMIT\s+APPLIES)/i,
  productsCompletedOpsAggregate:
    /PRODUCTS?\s*[-–—]?\s*COMP(?:LETED)?\s*[/I|l1]?\s*OP(?:ERATION)?S?\.?\s*AGG(?:REGATE)?/i,
  combinedSingleLimit: /COMBINED\s*SINGLE\s*LIMIT/i,
  umbrellaEachOccurrence: EACH_OCCURRENCE,
  umbrellaAggregate: /(?<!GEN\S*\s*)\bAGG(?:REGATE)?\b/i,
  employersLiabilityEachAccident: /E\.?\s*L\.?\s*EACH\s*ACCIDENT/i,
  employersLiabilityDiseaseEachEmployee: /DISEASE\s*[-–—]?\s*EA(?:CH)?\.?\s*EMPLOYEE/i,
  employersLiabilityDiseasePolicyLimit: /DISEASE\s*[-–—]?\s*POLICY\s*LIMIT/i,
};
const LIMIT_LABELS = Object.fromEntries(
  insuranceCoverageCodes.map((code) => [
    code,
    LIMIT_LINES_BY_COVERAGE[code].map((name): [LimitName, RegExp] => [name, LIMIT_PATTERNS[name]]),
  ]),
) as Record<InsuranceCoverageCode, [LimitName, RegExp][]>;

// An amount may sit a little after its label ("$", dots, OCR debris), never further than this.
const AMOUNT_SEARCH_CHARS = 40;

function toLines(text: string): string[] {
  return text
    .replace(/\r\n?/g, "\n")
    .split("\n")
    .map((line) => line.replace(/\t/g, "   ").replace(/[’‘`]/g, "'").trimEnd())
    .filter((line) => line.trim() !== "");
}

// Digits grouped by commas (or periods, as OCR often reads them), or plain; then cents; then a word for millions.
const AMOUNT =
  /(\d[\dOo]{0,2}(?:[,.]\s?[\dOo]{3})+|\d[\dOo]*)(?:\.(\d{1,2})(?!\d))?(?:\s?(MM|M|MIL(?:LION)?|K)(?![A-Za-z]))?/i;
const SUFFIX_SCALE: Record<string, number> = { MM: 1_000_000, M: 1_000_000, MIL: 1_000_000, K: 1_000 };

/**
 * Reads "$ 1,000,000", "1,000,000.00", "1.000.000", "1, 000,0O0", "$1M", "1MM", "$2.5 million" and "$500K" as whole
 * dollars. `scale` is 1000 on a table printed "(000s omitted)"; an amount that says its own unit is not scaled.
 */
export function parseScaledAmount(fragment: string, scale: number): number | undefined {
  const match = AMOUNT.exec(fragment.slice(0, AMOUNT_SEARCH_CHARS));
  if (!match) return undefined;
  const digits = (match[1] ?? "").replace(/[Oo]/g, "0").replace(/\D/g, "");
  if (digits === "") return undefined;
  const suffix = match[3]?.toUpperCase().replace(/LION$/, "");
  if (suffix) {
    const amount = Number(`${digits}.${match[2] ?? "0"}`) * (SUFFIX_SCALE[suffix] ?? 1);
    return Math.round(amount);
  }
  return Number(digits) * scale;
}

/** Whole dollars from an amount printed in dollars. */
export const parseAmount = (fragment: string): number | undefined => parseScaledAmount(fragment, 1);

/** A certificate whose limits are printed in thousands says so once, usually over the limits column. */
export const THOUSANDS_OMITTED =
  /\(?\s*(?:\$\s*)?0{3}\s*'?\s*s?\s+omitted\s*\)?|\bin\s+thousands\b|\(\s*\$\s*0{3}\s*'?s?\s*\)|\bthousands\s+omitted\b/i;

/** The part of a line before the next wide gap or right-hand box, for a left-hand box's value. */
function leftCell(line: string): string {
  const cut =
    line.split(
      /\s{3,}|\b(?:INSURERS?\s+[A-F]\b|INSURERS\b|CONTACT\b|PHONE\b|E-?MAIL\b|FAX\b|NAIC\b|CANCELLATION\b)/i,
    )[0] ?? "";
  return cut.replace(/^[\s:|_-]+|[\s:|_-]+$/g, "").replace(/\s+/g, " ");
}

function valueUnderLabel(lines: string[], label: RegExp): string | undefined {
  const index = lines.findIndex((line) => label.test(line));
  if (index < 0) return undefined;
  const sameLine = leftCell((lines[index] ?? "").replace(label, "").replace(/^[\s:]+/, ""));
  if (sameLine.length > 1) return sameLine;
  const next = lines[index + 1];
  const value = next === undefined ? "" : leftCell(next);
  // A street address under the label means the name was not where we looked: empty beats wrong.
  return value.length > 1 && !/^\d+\s+\S+/.test(value) ? value : undefined;
}

function readInsurers(lines: string[]): CertificateReading["insurers"] {
  const insurers: CertificateReading["insurers"] = [];
  for (const line of lines) {
    const match = /\bINSURER\s+([A-F])\s*[:;.,]?\s+(\S.*)$/i.exec(line);
    if (!match || insurers.some((insurer) => insurer.letter === match[1]?.toUpperCase())) continue;
    const rest = (match[2] ?? "").trim();
    const naicMatch = /\s([\dOo]{4,6})$/.exec(rest);
    const name = (naicMatch ? rest.slice(0, naicMatch.index) : rest)
      .replace(/\s*\(?\s*NAIC\s*(?:#|NO\.?|CODE)?\s*:?\s*\)?\s*$/i, "")
      .replace(/\s+/g, " ")
      .trim();
    if (name === "") continue;
    const naic = naicMatch?.[1]?.replace(/[Oo]/g, "0");
    insurers.push({ letter: (match[1] ?? "").toUpperCase(), name, ...(naic ? { naic } : {}) });
  }
  return insurers;
}

const INSURER_LINE = /^\s*INSURER\s+[A-F]\s*[:;.,]/i;

function coverageSections(lines: string[]): Partial<Record<InsuranceCoverageCode, string[]>> {
  const start = Math.max(
    0,
    // "Coverages (continued)" heads page 2; the table began on page 1, with or without a heading of its own.
    lines.findIndex((line) => /TYPE\s+OF\s+INSURANCE|\bCOVERAGES\b/i.test(line) && !/CONTINUED/i.test(line)),
  );
  const endIndex = lines.findIndex((line, i) => i > start && /DESCRIPTION\s+OF\s+OPERATIONS/i.test(line));
  const table = lines.slice(start, endIndex < 0 ? lines.length : endIndex);
  const starts: { code: InsuranceCoverageCode; at: number }[] = [];
  table.forEach((line, at) => {
    // "Insurer C: Workers Comp Mutual" names an insurer, not a coverage line.
    if (INSURER_LINE.test(line)) return;
    for (const code of insuranceCoverageCodes) {
      if (COVERAGE_MARKERS[code].test(line) && !starts.some((s) => s.code === code))
        starts.push({ code, at });
    }
  });
  starts.sort((a, b) => a.at - b.at);
  const sections: Partial<Record<InsuranceCoverageCode, string[]>> = {};
  starts.forEach((section, i) => {
    sections[section.code] = table.slice(section.at, starts[i + 1]?.at ?? table.length);
  });
  return sections;
}

function readLimits(code: InsuranceCoverageCode, section: string[], scale: number): Limits {
  const limits: Limits = {};
  for (const [at, line] of section.entries()) {
    const hits = LIMIT_LABELS[code]
      .map(([name, label]) => ({ name, match: label.exec(line) }))
      .filter((hit): hit is { name: LimitName; match: RegExpExecArray } => hit.match !== null)
      .sort((a, b) => a.match.index - b.match.index);
    hits.forEach((hit, i) => {
      const from = hit.match.index + hit.match[0].length;
      const rest = line.slice(from, hits[i + 1]?.match.index ?? line.length);
      // A label alone on its line ("Each occurrence" / "$1M" below it), or with only a qualifier and no figure after
      // it ("Combined single limit (ea accident)"): the amount is the whole next line.
      const below = section[at + 1]?.trim() ?? "";
      const fragment =
        !/\d/.test(rest) && hits.length === 1 && /^\$?\s?[\d,.]+\s?(?:MM|M|K)?$/i.test(below) ? below : rest;
      const amount = parseScaledAmount(fragment, scale);
      if (amount !== undefined && limits[hit.name] === undefined) limits[hit.name] = amount;
    });
  }
  return limits;
}

const isDateToken = (token: string): boolean => parseDocumentDate(token) !== null;
const isJunkToken = (token: string): boolean => !/[A-Za-z0-9]/.test(token);
const flagOf = (token: string): string | undefined => {
  const letters = token.replace(/[^A-Za-z]/g, "").toUpperCase();
  return /^(?:Y|N|X|XX)$/.test(letters) && token.length <= 3 ? letters.slice(0, 1) : undefined;
};
// A group of a spaced policy number: digits, or two to four capitals that are not a Y/N/X mark or insurer letter.
const isPolicyPart = (token: string): boolean =>
  /^\d{2,}[-/]?$/.test(token) || (/^[A-Z]{2,4}[-/]?$/.test(token) && flagOf(token) === undefined);
const looksLikePolicyNumber = (token: string): boolean =>
  /\d/.test(token) && /^[A-Z0-9][A-Z0-9\-/.]{3,}$/i.test(token);

function readRow(section: string[], code: InsuranceCoverageCode, scale: number): CoverageReading {
  const reading: CoverageReading = { limits: readLimits(code, section, scale) };
  const markerLine = section[0] ?? "";
  const beforeMarker = markerLine
    .slice(0, COVERAGE_MARKERS[code].exec(markerLine)?.index ?? 0)
    .replace(/[^A-Za-z]/g, "");
  if (/^[A-F]$/i.test(beforeMarker)) reading.insurerLetter = beforeMarker.toUpperCase();
  const rowLine =
    section.find((line) => (line.match(DATE_IN_TEXT) ?? []).length >= 2) ??
    section.find((line) => DATE_IN_TEXT.test(line));
  DATE_IN_TEXT.lastIndex = 0;
  if (rowLine !== undefined) readRowLine(rowLine, reading);
  readLabelledSection(section, reading);
  const sectionText = section.join("\n");
  if (code === "workers_comp" && /PER\s*STATUTE|STATUTORY/i.test(sectionText)) {
    reading.statutory = /\b[xX]+\s*PER\s*STATUTE|STATUTORY\s*[:\s]\s*(?:X|YES|Y)\b/i.test(sectionText);
  }
  return reading;
}

const SECTION_LABELS = {
  policyNumber: /\b(?:POLICY\s*(?:NO\.?|NUMBER|NUM\.?|#)|POL\.?\s*(?:#|NO\.?))\s*[:.]?/i,
  effectiveDate: /\b(?:POLICY\s+)?(?:EFFECTIVE(?:\s+DATE)?|EFF\.?(?:\s+DATE)?|PERIOD\s+FROM|FROM)\s*[:.]?/i,
  expirationDate:
    /\b(?:POLICY\s+)?(?:EXPIRATION(?:\s+DATE)?|EXPIRES|EXPIRY(?:\s+DATE)?|EXP\.?(?:\s+DATE)?|TO)\s*[:.]?/i,
  // The short forms "AI" and "WOS" only as a label: followed by a colon, a cell gap or a lone mark.
  additionalInsured:
    /\b(?:ADD(?:ITIONA)?L\.?\s*INS(?:URED|D)?\b|A\.?I\.?(?=\s*:|\s{3,}|\s+(?:Y|N|YES|NO|X)\s*$))\s*[:.?]?/i,
  waiverOfSubrogation:
    /\b(?:(?:WAIVER\s+OF\s+SUBROGATION|SUBR(?:OGATION)?\.?\s*(?:WVD|WAIVED))\b|W\.?O\.?S\.?(?=\s*:|\s{3,}|\s+(?:Y|N|YES|NO|X)\s*$))\s*[:.?]?/i,
  insurer:
    /\b(?:(?:INSURER|COMPANY)\s+AFFORDING\s+COVERAGE|INSURER|CARRIER|WRITTEN\s+BY|INSURANCE\s+COMPANY)\b(?!\s+[A-F]\s*[:;.,])(?:\s*[:.]|(?=\s{3,})|\s*$)/i,
  naic: /\bNAIC\s*(?:#|NO\.?|CODE)?\s*[:.]?\s*([\dOo]{5})\b/i,
} as const;

/** The text right after a label on its line, up to a wide gap; or the next line when the label stands alone. */
function afterLabel(section: string[], label: RegExp): { value: string; line: number } | undefined {
  for (let i = 0; i < section.length; i += 1) {
    const line = section[i] ?? "";
    const match = label.exec(line);
    if (!match) continue;
    const rest =
      line
        .slice(match.index + match[0].length)
        .trimStart()
        .split(/\s{3,}/)[0]
        ?.trim() ?? "";
    if (rest !== "") return { value: rest, line: i };
    // The line below is the value only when it is not itself another label.
    if (Object.values(SECTION_LABELS).some((other) => other.exec(section[i + 1] ?? "")?.index === 0))
      continue;
    const next = section[i + 1]
      ?.trim()
      .split(/\s{3,}/)[0]
      ?.trim();
    if (next) return { value: next, line: i + 1 };
  }
  return undefined;
}

const markOf = (value: string): boolean | undefined => {
  const word =
    value
      .trim()
      .split(/\s+/)[0]
      ?.toUpperCase()
      .replace(/[^A-Z]/g, "") ?? "";
  if (["Y", "YES", "X", "XX"].includes(word)) return true;
  if (["N", "NO", "NONE"].includes(word)) return false;
  return undefined;
};

/** Fields printed with their own labels inside a coverage's block, for layouts that are not one boxed row. */
function readLabelledSection(section: string[], reading: CoverageReading): void {
  const policy = afterLabel(section, SECTION_LABELS.policyNumber);
  if (reading.policyNumber === undefined && policy) {
    const value = policy.value.replace(/[.,;:]+$/, "").trim();
    if (/\d/.test(value) && /^[A-Z0-9][A-Z0-9\-/. ]{3,40}$/i.test(value) && !DATE_ONLY.test(value))
      reading.policyNumber = value.replace(/\s+/g, " ");
  }
  for (const key of ["effectiveDate", "expirationDate"] as const) {
    if (reading[key] !== undefined) continue;
    const found = afterLabel(section, SECTION_LABELS[key]);
    const date = found ? findDocumentDates(found.value)[0] : undefined;
    if (date) reading[key] = date;
  }
  for (const key of ["additionalInsured", "waiverOfSubrogation"] as const) {
    if (reading[key] !== undefined) continue;
    const found = afterLabel(section, SECTION_LABELS[key]);
    const mark = found ? markOf(found.value) : undefined;
    if (mark !== undefined) reading[key] = mark;
  }
  const insurer = afterLabel(section, SECTION_LABELS.insurer);
  if (insurer && reading.insurerLetter === undefined) {
    const letter = /^([A-F])$/i.exec(insurer.value.trim());
    if (letter) reading.insurerLetter = letter[1]!.toUpperCase();
    else {
      const name = insurer.value.replace(/\(?\s*NAIC.*$/i, "").replace(/[\s,;:]+$/, "");
      if (name.length > 2) reading.insurerName = name;
    }
  }
  const naic = section.map((line) => SECTION_LABELS.naic.exec(line)).find((m) => m !== null);
  if (naic && reading.naic === undefined) reading.naic = naic[1]!.replace(/[Oo]/g, "0");
}

const DATE_ONLY = new RegExp(`^(?:${DATE_IN_TEXT.source})$`, "i");

function readRowLine(rowLine: string, reading: CoverageReading): void {
  const dates = [...rowLine.matchAll(DATE_IN_TEXT)]
    .map((m) => parseDocumentDate(m[0]))
    .filter((d): d is string => d !== null);
  if (dates[0]) reading.effectiveDate = dates[0];
  if (dates[1]) reading.expirationDate = dates[1];
  const tokens = rowLine
    .replace(DATE_IN_TEXT, " @DATE@ ")
    .split(/\s+/)
    .filter((t) => t !== "");
  const firstDate = tokens.findIndex((t) => t === "@DATE@" || isDateToken(t));
  let i = firstDate - 1;
  while (i >= 0 && isJunkToken(tokens[i] ?? "")) i -= 1;
  const policy = tokens[i];
  if (policy === undefined || !looksLikePolicyNumber(policy)) return;
  // A number printed with spaces ("CGL 778 1203") comes as several tokens: short capital or digit groups.
  const parts = [policy.replace(/[.,;:]+$/, "")];
  while (i > 0 && isPolicyPart(tokens[i - 1] ?? "") && parts.length < 4) {
    parts.unshift(tokens[i - 1] ?? "");
    i -= 1;
  }
  reading.policyNumber = parts.join(" ");
  const flags: string[] = [];
  for (let j = i - 1; j >= 0 && flags.length < 2; j -= 1) {
    const token = tokens[j] ?? "";
    if (isJunkToken(token)) continue;
    const flag = flagOf(token);
    if (flag === undefined) break;
    flags.unshift(flag);
  }
  const first = tokens[0]?.replace(/[^A-Za-z]/g, "") ?? "";
  if (reading.insurerLetter === undefined && /^[A-F]$/i.test(first))
    reading.insurerLetter = first.toUpperCase();
  // With both columns marked we know which is which; one lone mark could be either column, so it is left to the reviewer.
  if (flags.length === 2) {
    reading.additionalInsured = flags[0] !== "N";
    reading.waiverOfSubrogation = flags[1] !== "N";
  } else if (flags.length === 0) {
    reading.additionalInsured = false;
    reading.waiverOfSubrogation = false;
  }
}

/** Everything a certificate of insurance says that we can read: parties, insurers and each coverage row. */
export function readCertificate(text: string): CertificateReading {
  const lines = toLines(text);
  const sections = coverageSections(lines);
  const scale = THOUSANDS_OMITTED.test(text) ? 1000 : 1;
  const coverages: CertificateReading["coverages"] = {};
  for (const code of insuranceCoverageCodes) {
    const section = sections[code];
    if (section) coverages[code] = readRow(section, code, scale);
  }
  const reading: CertificateReading = { insurers: readInsurers(lines), coverages };
  const producer = valueUnderLabel(lines, /^\s*PRODUCER\b:?/i);
  const namedInsured = valueUnderLabel(lines, /^\s*(?:NAMED\s+)?INSURED\b(?!\s*:?\s*$)?:?/i);
  const certificateHolder = valueUnderLabel(lines, /^\s*CERTIFICATE\s+HOLDER\b:?/i);
  if (producer) reading.producer = producer;
  if (namedInsured) reading.namedInsured = namedInsured;
  if (certificateHolder) reading.certificateHolder = certificateHolder;
  return reading;
}

function proposeInsurance(typeCode: string, text: string): FieldProposal<"insurance"> {
  return proposeCoverage(typeCode, readCertificate(text));
}

function proposeCoverage(typeCode: string, reading: CertificateReading): FieldProposal<"insurance"> {
  const fields: Partial<InsuranceFields> = {};
  const found: string[] = [];
  const put = <K extends keyof InsuranceFields>(key: K, value: InsuranceFields[K] | undefined): void => {
    if (value === undefined) return;
    fields[key] = value;
    found.push(key);
  };
  put("namedInsured", reading.namedInsured);
  put("certificateHolder", reading.certificateHolder);
  const row = (insuranceCoverageCodes as readonly string[]).includes(typeCode)
    ? reading.coverages[typeCode as InsuranceCoverageCode]
    : undefined;
  if (!row) return { fields, found };
  const insurer = reading.insurers.find((candidate) => candidate.letter === row.insurerLetter);
  put("insurerName", insurer?.name ?? row.insurerName);
  put("naic", insurer?.naic ?? row.naic);
  put("policyNumber", row.policyNumber);
  put("effectiveDate", row.effectiveDate);
  put("expirationDate", row.expirationDate);
  put("additionalInsured", row.additionalInsured);
  put("waiverOfSubrogation", row.waiverOfSubrogation);
  put("statutory", row.statutory);
  fields.limits = row.limits;
  found.push(...Object.keys(row.limits).map((name) => `limits.${name}`));
  return { fields, found };
}

export interface CertificateProposal {
  /** Printed once for the whole document. */
  parties: { producer?: string; namedInsured?: string; certificateHolder?: string };
  /** One proposal per coverage line found, in the order of insuranceCoverageCodes. */
  coverages: { typeCode: InsuranceCoverageCode; proposal: FieldProposal<"insurance"> }[];
}

/** Every coverage a certificate of insurance lists, each proposed as its own credential. */
export function proposeCoverages(text: string): CertificateProposal {
  const reading = readCertificate(text);
  const parties: CertificateProposal["parties"] = {};
  if (reading.producer) parties.producer = reading.producer;
  if (reading.namedInsured) parties.namedInsured = reading.namedInsured;
  if (reading.certificateHolder) parties.certificateHolder = reading.certificateHolder;
  return {
    parties,
    coverages: insuranceCoverageCodes
      .filter((code) => reading.coverages[code] !== undefined)
      .map((typeCode) => ({ typeCode, proposal: proposeCoverage(typeCode, reading) })),
  };
}

const CARD_LABELS = {
  holderName:
    /\b(?:NAME(?:\s+OF\s+(?:STUDENT|TRAINEE|PARTICIPANT|EMPLOYEE|OPERATOR))?|HOLDER|STUDENT|PARTICIPANT|TRAINEE|LICENSEE|ISSUED\s+TO|AWARDED\s+TO|PRESENTED\s+TO)\b(?!\s+(?:OF\s+(?:TRAINER|INSTRUCTOR|EVALUATOR|PROVIDER)))/i,
  course:
    /\b(?:COURSE(?:\s+TITLE)?|PROGRAM|TRAINING|CLASS|SUBJECT)\b(?!\s+(?:PROVIDER|BY|DATE|CENTER|CENTRE|INSTITUTE))/i,
  issueDate:
    /\b(?:DATE\s+ISSUED|ISSUE\s+DATE|ISSUED(?:\s+ON)?(?!\s+(?:BY|TO))|COMPLETION\s+DATE|DATE\s+(?:OF\s+)?COMPLETION|DATE\s+COMPLETED|COMPLETED(?:\s+ON)?|DATE\s+OF\s+(?:TRAINING|EVALUATION|CLASS)|EVALUATION\s+DATE|EVALUATED\s+ON|TRAINING\s+DATE|CLASS\s+DATE)\b/i,
  expiryDate:
    /\b(?:EXPIRATION(?:\s+DATE)?|EXPIRY(?:\s+DATE)?|EXPIRES(?:\s+ON)?|VALID\s+(?:UNTIL|THRU|THROUGH|TO)|GOOD\s+(?:THRU|THROUGH)|RE-?EVALUATION\s+DUE|RE-?CERTIFICATION\s+DUE|RETRAIN(?:ING)?\s+(?:DUE|BY)|RENEW(?:AL)?\s+(?:BY|DUE|DATE)|RECOMMENDED\s+RENEWAL(?:\s+DATE)?|DUE\s+FOR\s+RENEWAL)\b/i,
  cardNumber:
    /\b(?:(?:CARD|CERTIFICATE|CERT\.?|STUDENT|RECORD)\s*(?:NO\.?|NUMBER|#|ID)|ID\s*(?:NO\.?|#|NUMBER))/i,
  licenseNumber: /\bLICEN[CS]E\s*(?:NO\.?|NUMBER|#)/i,
  trainer:
    /\b(?:TRAINER(?:\s+NAME)?|INSTRUCTOR(?:\s+NAME)?|EVALUATOR|EVALUATED\s+BY(?!\s*[:.]?\s*\d)|AUTHORI[SZ]ED\s+TRAINER)\b/i,
  issuingAuthority: /\b(?:ISSUED\s+BY|ISSUING\s+AUTHORITY|AUTHORITY)\b/i,
  state: /\bSTATE\b/i,
  builder: /\b(?:BUILDER|MANUFACTURER)\b/i,
  controlFamily: /\bCONTROL(?:\s+FAMILY)?\b/i,
  level: /\bLEVEL\b/i,
} as const;
type CardLabel = keyof typeof CARD_LABELS;

const anyCardLabel = (text: string): boolean =>
  Object.values(CARD_LABELS).some((re) => {
    const match = re.exec(text);
    return match !== null && match.index < 2;
  });

/**
 * A line that is a label (alone, or followed by a colon or a wide gap), not a value that happens to open with a
 * label's word: "Control of Hazardous Energy" under "Training" is a course title, not the "Control" label.
 */
const isLabelLine = (text: string): boolean =>
  Object.values(CARD_LABELS).some((re) => {
    const match = re.exec(text);
    if (match === null || match.index >= 2) return false;
    const after = text.slice(match.index + match[0].length);
    return after.trim() === "" || /^\s*[:#.]/.test(after) || /^\s{2,}/.test(after);
  });

// Without a colon or a gap, a label joined to its value by one space is trusted only where the value has the shape
// its field always has: an identifier with digits (card numbers the trade prints: "TC-40213", "QW 81551" reads as its
// first part) or a person's name filling the rest of the cell.
const SPACED_VALUE: Partial<Record<CardLabel, RegExp>> = {
  cardNumber: /^(?=[A-Z0-9-]*\d{3})[A-Z0-9][A-Z0-9-]{3,19}$/i,
  licenseNumber: /^(?=[A-Z0-9-]*\d{3})[A-Z0-9][A-Z0-9-]{3,19}$/i,
  trainer: /^[A-Z][a-z'.-]+(?:\s+[A-Z][a-z'.-]+){1,3}$/,
};

/**
 * The value after a label: on the same line ("Label: value", or a wide gap without a colon), up to the next known
 * label or wide gap; or, when the label stands alone at the end of its line, the line below it.
 */
function* labelledValues(lines: string[], key: CardLabel): Generator<string> {
  const others = Object.entries(CARD_LABELS)
    .filter(([other]) => other !== key)
    .map(([, re]) => re);
  for (const [index, line] of lines.entries()) {
    const match = CARD_LABELS[key].exec(line);
    if (!match) continue;
    const after = line.slice(match.index + match[0].length);
    const standsAlone = after.trim() === "" || /^\s*[:#.]\s*$/.test(after);
    if (standsAlone) {
      const below = (lines[index + 1] ?? "").split(/\s{3,}/)[0]?.trim() ?? "";
      if (below !== "" && !isLabelLine(below)) yield below.replace(/\s+/g, " ");
      continue;
    }
    if (!/^\s*[:#.]/.test(after) && !/^\s{2,}/.test(after)) {
      const shape = SPACED_VALUE[key];
      const cell = after.split(/\s{3,}/)[0]?.trim() ?? "";
      if (shape && /^ \S/.test(after) && shape.test(cell)) yield cell;
      continue;
    }
    let value = after.replace(/^[\s:#.]+/, "").split(/\s{3,}/)[0] ?? "";
    for (const other of others) {
      const cut = other.exec(value);
      if (cut && cut.index > 0) value = value.slice(0, cut.index);
    }
    value = value
      .replace(/[\s,;|]+$/, "")
      .replace(/\s+/g, " ")
      .trim();
    if (value !== "") yield value;
  }
}

function labelledValue(lines: string[], key: CardLabel): string | undefined {
  for (const value of labelledValues(lines, key)) return value;
  return undefined;
}

// "This certifies that NAME has (successfully) completed (the) COURSE", the wording of many wall certificates.
const SENTENCE_CARD =
  /\b(?:certif(?:y|ies)|confirms?|attests?)\s+that\s+(.+?)\s+(?:has|have)\s+(?:successfully\s+)?(?:completed|passed|attended|satisfactorily\s+completed)\s+(?:the\s+)?(?:requirements\s+(?:of|for)\s+(?:the\s+)?)?(.+?)(?:\s+(?:on|dated?)\s+[A-Z0-9]|[.]\s|$)/i;

function readSentenceCard(lines: string[]): { holderName?: string; course?: string } {
  const text = lines.map((line) => line.trim()).join(" ");
  const match = SENTENCE_CARD.exec(text);
  if (!match) return {};
  const holderName = (match[1] ?? "").replace(/\s+/g, " ").trim();
  const course = (match[2] ?? "")
    .replace(/\s+(?:course|training|program)$/i, (word) => word)
    .replace(/[\s,;]+$/, "")
    .trim();
  const result: { holderName?: string; course?: string } = {};
  // A name is two to five words; anything longer is the sentence read wrong, so it is left out.
  if (/^[A-Za-z][A-Za-z.'-]*(?:\s+[A-Za-z][A-Za-z.'-]*){1,4}$/.test(holderName))
    result.holderName = holderName;
  if (course.length >= 4 && course.length <= 120) result.course = course;
  return result;
}

/** A course title wrapped over two lines: the next line carries on when it has no label and no date. */
function unwrapCourse(lines: string[], course: string | undefined): string | undefined {
  if (!course) return course;
  const at = lines.findIndex((line) => line.includes(course));
  const next = lines[at + 1]?.trim();
  if (at < 0 || !next || anyCardLabel(next) || DATE_ONLY.test(next) || findDocumentDates(next).length > 0)
    return course;
  const continues =
    /^[a-z(&]|^(?:and|of|for|with|in)\b/.test(next) || /(?:\band|\bof|\bfor|[-&,/(])$/i.test(course);
  return continues ? `${course} ${next.split(/\s{3,}/)[0]}`.replace(/\s+/g, " ").trim() : course;
}

const ROMAN_LEVELS: Record<string, number> = { I: 1, II: 2, III: 3, "1": 1, "2": 2, "3": 3 };

function proposeCard(fieldSet: Exclude<FieldSet, "insurance">, text: string): FieldProposal {
  const lines = toLines(text);
  const fields: Record<string, string | number> = {};
  const found: string[] = [];
  const put = (key: string, value: string | number | undefined): void => {
    if (value === undefined || value === "") return;
    fields[key] = value;
    found.push(key);
  };
  // The first labelled value that holds a date: "has completed" in a sentence is a label with no date after it.
  const date = (key: CardLabel): string | undefined => {
    for (const raw of labelledValues(lines, key)) {
      const match = new RegExp(DATE_IN_TEXT.source, "i").exec(raw);
      const full = match ? parseDocumentDate(match[0]) : null;
      if (full) return full;
      // Only an end date may be a month alone: valid through the end of that month.
      if (key !== "expiryDate") continue;
      const month = new RegExp(MONTH_IN_TEXT.source, "i").exec(raw);
      const end = month ? parseDocumentEndDate(month[0]) : null;
      if (end) return end;
    }
    // "Completed on 15 Jan 2026": a date right after its label, with no colon or gap between them.
    for (const line of lines) {
      const label = CARD_LABELS[key].exec(line);
      const cell = label ? line.slice(label.index + label[0].length).split(/\s{3,}/)[0] : undefined;
      const match = cell ? new RegExp(`^\\s*(?:${DATE_IN_TEXT.source})`, "i").exec(cell) : null;
      const full = match ? findDocumentDates(match[0])[0] : undefined;
      if (full) return full;
    }
    return undefined;
  };
  const sentence = readSentenceCard(lines);
  put("holderName", labelledValue(lines, "holderName") ?? sentence.holderName);
  put("issueDate", date("issueDate"));
  put("expiryDate", date("expiryDate"));
  if (fieldSet === "training" || fieldSet === "oem") {
    put("course", unwrapCourse(lines, labelledValue(lines, "course")) ?? sentence.course);
    put("cardNumber", labelledValue(lines, "cardNumber")?.split(" ")[0]);
    put("trainer", labelledValue(lines, "trainer"));
  }
  if (fieldSet === "oem") {
    put("builder", labelledValue(lines, "builder"));
    put("controlFamily", labelledValue(lines, "controlFamily"));
    put("level", ROMAN_LEVELS[(labelledValue(lines, "level") ?? "").split(" ")[0]?.toUpperCase() ?? ""]);
  }
  if (fieldSet === "license") {
    put("licenseNumber", labelledValue(lines, "licenseNumber")?.split(" ")[0]);
    put("issuingAuthority", labelledValue(lines, "issuingAuthority"));
  }
  if (fieldSet === "exemption") {
    put("certificateNumber", labelledValue(lines, "cardNumber")?.split(" ")[0]);
    const state = labelledValue(lines, "state")?.toUpperCase();
    if (state && /^[A-Z]{2}$/.test(state)) put("state", state);
  }
  return { fields, found };
}

/**
 * Proposes the fields of one credential from a document's text. For insurance, typeCode names the
 * coverage row to read; for the other field sets, typeCode only names the credential.
 */
export function proposeFields<S extends FieldSet>(
  typeCode: string,
  fieldSet: S,
  text: string,
): FieldProposal<S> {
  if (fieldSet === "insurance") return proposeInsurance(typeCode, text) as FieldProposal<S>;
  return proposeCard(fieldSet as Exclude<FieldSet, "insurance">, text) as FieldProposal<S>;
}
