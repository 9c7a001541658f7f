import { z } from "zod";
import { machineTechnologies, technologyLabels, type MachineTechnology } from "./schemas.ts";
import { wholeKmFromMiles } from "../geo/units.ts";

/** The columns an import understands, in template order, with the header the downloadable template uses. */
export const importFields = [
  { key: "name", header: "Name", required: true },
  { key: "email", header: "E-mail", required: false },
  { key: "phone", header: "Phone", required: false },
  { key: "postalCode", header: "ZIP", required: true },
  { key: "technologies", header: "Technologies", required: false },
  { key: "serviceRadiusMiles", header: "Service radius (miles)", required: true },
  { key: "hourlyRate", header: "Hourly rate ($)", required: true },
  { key: "travelRate", header: "Travel rate ($)", required: true },
] as const;
export type ImportFieldKey = (typeof importFields)[number]["key"];

/** Which header of the file feeds each field; a field left out is read as empty. */
export const columnMappingSchema = z.partialRecord(
  z.enum(importFields.map((f) => f.key) as [ImportFieldKey, ...ImportFieldKey[]]),
  z.string().max(200),
);
export type ColumnMapping = z.infer<typeof columnMappingSchema>;

/** The preview answer: each row with its problems, before anything is saved. */
export const technicianImportPreviewSchema = z.object({
  headers: z.array(z.string()),
  mapping: columnMappingSchema,
  rows: z.array(
    z.object({
      line: z.number(),
      name: z.string(),
      email: z.string().nullable(),
      problems: z.array(z.string()),
    }),
  ),
  goodCount: z.number(),
  badCount: z.number(),
});
export type TechnicianImportPreview = z.infer<typeof technicianImportPreviewSchema>;

/** The import's answer: how many were added and invited, and the rows left out with why. */
export const technicianImportReportSchema = z.object({
  imported: z.number(),
  invited: z.number(),
  skipped: z.array(z.object({ line: z.number(), problems: z.array(z.string()) })),
});
export type TechnicianImportReport = z.infer<typeof technicianImportReportSchema>;

const normalize = (s: string) =>
  s
    .trim()
    .toLowerCase()
    .replace(/[^a-z0-9]/g, "");

/** A first guess at the mapping: a header matching the template header or the field key, ignoring case and marks. */
export function guessMapping(headers: string[]): ColumnMapping {
  const mapping: ColumnMapping = {};
  for (const field of importFields) {
    const hit = headers.find(
      (h) => normalize(h) === normalize(field.header) || normalize(h) === normalize(field.key),
    );
    if (hit !== undefined) mapping[field.key] = hit;
  }
  return mapping;
}

export interface ImportRowInput {
  name: string;
  email: string | null;
  phone: string | null;
  postalCode: string;
  technologies: MachineTechnology[];
  serviceRadiusKm: number;
  hourlyRateCents: number;
  travelRateCents: number;
}

export interface CheckedRow {
  /** Line in the file as a spreadsheet numbers it, the header being line 1. */
  line: number;
  input: ImportRowInput | null;
  problems: string[];
}

const technologyByName = new Map<string, MachineTechnology>(
  machineTechnologies.flatMap((t) => [
    [normalize(t), t],
    [normalize(technologyLabels[t]), t],
  ]),
);

// Dollars as people type them in a spreadsheet: "150", "150.5", "$1,250.00"; kept as integer cents.
function dollarsToCents(raw: string): number | null {
  const cleaned = raw.replace(/[$,\s]/g, "");
  if (!/^\d{1,7}(\.\d{1,2})?$/.test(cleaned)) return null;
  const [whole, frac = ""] = cleaned.split(".");
  return Number(whole) * 100 + Number(frac.padEnd(2, "0"));
}

const emailCheck = z.email();

/**
 * Checks one row on its own (the ZIP look-up is passed in so this stays free of the server's data set);
 * duplicates across rows and against the platform are found by the caller, who sees them all.
 */
export function checkRow(
  line: number,
  record: Record<string, string>,
  mapping: ColumnMapping,
  isKnownZip: (zip: string) => boolean,
): CheckedRow {
  const get = (key: ImportFieldKey) => {
    const header = mapping[key];
    return header === undefined ? "" : (record[header] ?? "").trim();
  };
  const problems: string[] = [];

  const name = get("name");
  if (name.length < 2) problems.push("Name: missing");
  else if (name.length > 160) problems.push("Name: longer than 160 characters");
  // eslint-disable-next-line no-control-regex
  if (/[\u0000-\u001f\u007f]/.test(name)) problems.push("Name: contains control characters");

  const emailRaw = get("email").toLowerCase();
  const email = emailRaw === "" ? null : emailRaw;
  if (email && (email.length > 254 || !emailCheck.safeParse(email).success))
    problems.push(`E-mail: "${email.slice(0, 60)}" is not a valid address`);

  const phone = get("phone");
  if (phone.length > 40) problems.push("Phone: longer than 40 characters");

  const postalCode = get("postalCode");
  if (!/^\d{5}$/.test(postalCode)) problems.push(`ZIP: "${postalCode.slice(0, 20)}" is not five digits`);
  else if (!isKnownZip(postalCode)) problems.push(`ZIP: ${postalCode} is not a known US ZIP code`);

  const technologies: MachineTechnology[] = [];
  for (const part of get("technologies").split(/[;|,]/)) {
    if (part.trim() === "") continue;
    const hit = technologyByName.get(normalize(part));
    if (!hit) problems.push(`Technologies: unknown technology "${part.trim().slice(0, 40)}"`);
    else if (!technologies.includes(hit)) technologies.push(hit);
  }

  const radiusRaw = get("serviceRadiusMiles");
  const miles = /^\d{1,4}$/.test(radiusRaw) ? Number(radiusRaw) : NaN;
  const serviceRadiusKm = wholeKmFromMiles(miles);
  if (!Number.isFinite(miles) || miles < 1 || serviceRadiusKm > 2000)
    problems.push(`Service radius: "${radiusRaw.slice(0, 20)}" is not whole miles from 1 to 1,242`);

  const hourlyRateCents = dollarsToCents(get("hourlyRate"));
  if (hourlyRateCents === null || hourlyRateCents > 10_000_00)
    problems.push(`Hourly rate: "${get("hourlyRate").slice(0, 20)}" is not a dollar amount up to $10,000`);
  const travelRateCents = dollarsToCents(get("travelRate"));
  if (travelRateCents === null || travelRateCents > 10_000_00)
    problems.push(`Travel rate: "${get("travelRate").slice(0, 20)}" is not a dollar amount up to $10,000`);

  if (problems.length > 0) return { line, input: null, problems };
  return {
    line,
    problems,
    input: {
      name,
      email,
      phone: phone === "" ? null : phone,
      postalCode,
      technologies,
      serviceRadiusKm,
      hourlyRateCents: hourlyRateCents!,
      travelRateCents: travelRateCents!,
    },
  };
}

/** A template a spreadsheet opens: the headers and one example row (RFC 4180, CRLF line ends). */
export function importTemplateCsv(): string {
  const header = importFields.map((f) => f.header).join(",");
  const example = [
    "Example Person",
    "person@example.test",
    "555-0100",
    "53202",
    "Mill;Lathe",
    "150",
    "145.00",
    "95.00",
  ];
  return `${header}\r\n${example.join(",")}\r\n`;
}
