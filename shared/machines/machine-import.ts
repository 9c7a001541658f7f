import { z } from "zod";
import { machineTechnologies, technologyLabels, type MachineTechnology } from "../technicians/schemas.ts";
import { machineStates, type MachineState } from "../sites/schemas.ts";
import { findCatalogEntry, catalogKey, type CatalogEntryDto } from "./catalog.ts";

/** The columns a machine import understands, in template order, with the header the downloadable template uses. */
export const machineImportFields = [
  { key: "site", header: "Site", required: false },
  { key: "builder", header: "Builder", required: true },
  { key: "controlFamily", header: "Control", required: true },
  { key: "technology", header: "Technology", required: true },
  { key: "model", header: "Model", required: true },
  { key: "serialNumber", header: "Serial number", required: false },
  { key: "yearBuilt", header: "Year built", required: false },
  { key: "inServiceOn", header: "In service since", required: false },
  { key: "building", header: "Building", required: false },
  { key: "bay", header: "Bay", required: false },
  { key: "state", header: "State", required: false },
  { key: "notes", header: "Notes", required: false },
] as const;
export type MachineImportFieldKey = (typeof machineImportFields)[number]["key"];

export const MAX_MACHINE_IMPORT_ROWS = 2_000;

export const machineColumnMappingSchema = z.partialRecord(
  z.enum(machineImportFields.map((f) => f.key) as [MachineImportFieldKey, ...MachineImportFieldKey[]]),
  z.string().max(200),
);
export type MachineColumnMapping = z.infer<typeof machineColumnMappingSchema>;

const squash = (s: string) =>
  s
    .trim()
    .toLowerCase()
    .replace(/[^a-z0-9]/g, "");

/** A first guess at the mapping: a header matching the template header or the field key, ignoring case and marks. */
export function guessMachineMapping(headers: string[]): MachineColumnMapping {
  const mapping: MachineColumnMapping = {};
  const extra: Partial<Record<MachineImportFieldKey, string[]>> = {
    controlFamily: ["controlfamily", "cnc", "controller"],
    serialNumber: ["serial", "serialno", "sn"],
    yearBuilt: ["year"],
    inServiceOn: ["inservice", "inservicedate", "installed"],
  };
  for (const field of machineImportFields) {
    const names = [squash(field.header), squash(field.key), ...(extra[field.key] ?? [])];
    const hit = headers.find((h) => names.includes(squash(h)));
    if (hit !== undefined) mapping[field.key] = hit;
  }
  return mapping;
}

export interface MachineRowInput {
  siteId: number;
  builder: string;
  controlFamily: string;
  technology: MachineTechnology;
  model: string;
  serialNumber: string | null;
  yearBuilt: number | null;
  inServiceOn: string | null;
  building: string | null;
  bay: string | null;
  state: MachineState;
  notes: string | null;
}

/** One thing wrong with one cell: the spreadsheet line, the column as the file names it, and why. */
export interface RowProblem {
  line: number;
  column: string;
  field: MachineImportFieldKey;
  reason: string;
}

export interface CheckedMachineRow {
  /** Line in the file as a spreadsheet numbers it, the header being line 1. */
  line: number;
  input: MachineRowInput | null;
  problems: RowProblem[];
  /** Builder and serial as the platform knows a machine, whenever both can be read, even if other cells are wrong. */
  key: string | null;
}

export interface ImportContext {
  sites: { id: number; name: string }[];
  /** The site for rows whose site cell is empty (or when no column holds sites). */
  defaultSiteId: number | null;
  builders: CatalogEntryDto[];
  controls: CatalogEntryDto[];
  /** The year the import runs in, passed in: shared code never reads the clock. */
  currentYear: number;
}

const technologyByName = new Map<string, MachineTechnology>(
  machineTechnologies.flatMap((t) => [
    [squash(t), t],
    [squash(technologyLabels[t]), t],
  ]),
);
const stateByName = new Map<string, MachineState>(machineStates.map((s) => [squash(s), s]));

/** A calendar date written as ISO (2019-06-03) or as US spreadsheets export it (6/3/2019). */
export function readCalendarDate(raw: string): string | null {
  let y: number, m: number, d: number;
  const iso = /^(\d{4})-(\d{1,2})-(\d{1,2})$/.exec(raw);
  const us = /^(\d{1,2})\/(\d{1,2})\/(\d{4})$/.exec(raw);
  if (iso) [y, m, d] = [Number(iso[1]), Number(iso[2]), Number(iso[3])];
  else if (us) [m, d, y] = [Number(us[1]), Number(us[2]), Number(us[3])];
  else return null;
  const date = new Date(Date.UTC(y, m - 1, d));
  if (date.getUTCFullYear() !== y || date.getUTCMonth() !== m - 1 || date.getUTCDate() !== d) return null;
  return date.toISOString().slice(0, 10);
}

// eslint-disable-next-line no-control-regex
const CONTROL = /[\u0000-\u0008\u000B-\u001F\u007F]/;
// eslint-disable-next-line no-control-regex
const CONTROL_OR_BREAK = /[\u0000-\u001F\u007F]/;

/**
 * Checks one row on its own against the shop's sites and the catalog; duplicates across rows and against the platform
 * are found by the caller, who sees them all.
 */
export function checkMachineRow(
  line: number,
  record: Record<string, string>,
  mapping: MachineColumnMapping,
  ctx: ImportContext,
): CheckedMachineRow {
  const problems: RowProblem[] = [];
  const columnOf = (key: MachineImportFieldKey) =>
    mapping[key] ?? machineImportFields.find((f) => f.key === key)!.header;
  const get = (key: MachineImportFieldKey) => {
    const header = mapping[key];
    return header === undefined ? "" : (record[header] ?? "").trim();
  };
  const problem = (field: MachineImportFieldKey, reason: string) =>
    problems.push({ line, column: columnOf(field), field, reason });
  const text = (field: MachineImportFieldKey, max: number, required: boolean): string | null => {
    // Only the notes may span lines; a cell's CRLF becomes a plain line feed, as typed text does.
    const value = field === "notes" ? get(field).replace(/\r\n?/g, "\n") : get(field);
    if (value === "") {
      if (required) problem(field, "missing");
      return null;
    }
    if (value.length > max) problem(field, `longer than ${max} characters`);
    if ((field === "notes" ? CONTROL : CONTROL_OR_BREAK).test(value))
      problem(field, "contains control characters");
    return value;
  };

  const siteCell = get("site");
  let siteId: number | null = null;
  if (siteCell !== "") {
    siteId = ctx.sites.find((s) => catalogKey(s.name) === catalogKey(siteCell))?.id ?? null;
    if (siteId === null) problem("site", `"${siteCell.slice(0, 60)}" is not one of your sites`);
  } else if (ctx.defaultSiteId !== null) siteId = ctx.defaultSiteId;
  else problem("site", "missing, and no site was chosen for rows without one");

  const builderCell = get("builder");
  const builder = builderCell === "" ? null : findCatalogEntry(ctx.builders, builderCell);
  if (builderCell === "") problem("builder", "missing");
  else if (!builder) problem("builder", `"${builderCell.slice(0, 60)}" is not in the builders catalog`);
  const controlCell = get("controlFamily");
  const control = controlCell === "" ? null : findCatalogEntry(ctx.controls, controlCell);
  if (controlCell === "") problem("controlFamily", "missing");
  else if (!control) problem("controlFamily", `"${controlCell.slice(0, 60)}" is not in the controls catalog`);

  const technologyCell = get("technology");
  const technology = technologyByName.get(squash(technologyCell));
  if (technologyCell === "") problem("technology", "missing");
  else if (!technology) problem("technology", `unknown technology "${technologyCell.slice(0, 40)}"`);

  const model = text("model", 120, true);
  const serialNumber = text("serialNumber", 80, false);
  const building = text("building", 80, false);
  const bay = text("bay", 40, false);
  const notes = text("notes", 4000, false);

  const yearCell = get("yearBuilt");
  let yearBuilt: number | null = null;
  if (yearCell !== "") {
    yearBuilt = /^\d{4}$/.test(yearCell) ? Number(yearCell) : NaN;
    if (!(yearBuilt >= 1900 && yearBuilt <= ctx.currentYear + 1))
      problem("yearBuilt", `"${yearCell.slice(0, 20)}" is not a year from 1900 to ${ctx.currentYear + 1}`);
  }
  const dateCell = get("inServiceOn");
  const inServiceOn = dateCell === "" ? null : readCalendarDate(dateCell);
  if (dateCell !== "" && inServiceOn === null)
    problem("inServiceOn", `"${dateCell.slice(0, 20)}" is not a date (YYYY-MM-DD or M/D/YYYY)`);

  const stateCell = get("state");
  const state = stateCell === "" ? "running" : stateByName.get(squash(stateCell));
  if (!state) problem("state", `"${stateCell.slice(0, 30)}" is not running, down, out of service or sold`);

  const key = builder && serialNumber ? machineKey(builder.name, serialNumber) : null;
  if (problems.length > 0) return { line, input: null, problems, key };
  return {
    line,
    problems,
    key,
    input: {
      siteId: siteId!,
      builder: builder!.name,
      controlFamily: control!.name,
      technology: technology!,
      model: model!,
      serialNumber,
      yearBuilt,
      inServiceOn,
      building,
      bay,
      state: state!,
      notes,
    },
  };
}

/** The key one machine is known by on the platform: its builder and serial, whatever the case or spacing. */
export const machineKey = (builder: string, serialNumber: string) =>
  `${catalogKey(builder)}|${serialNumber.trim().toUpperCase()}`;

/** A template a spreadsheet opens: the headers and one example row (RFC 4180, CRLF line ends). */
export function machineImportTemplateCsv(): string {
  const header = machineImportFields.map((f) => f.header).join(",");
  const example = [
    "Main plant",
    "Vantor Machine Works",
    "Kestle 40",
    "Mill",
    "VM-450",
    "VX-000123",
    "2019",
    "2019-06-03",
    "B2",
    "Bay 4",
    "running",
    '"Through-spindle coolant, 12,000 rpm"',
  ];
  return `${header}\r\n${example.join(",")}\r\n`;
}

export const machineImportPreviewSchema = z.object({
  headers: z.array(z.string()),
  mapping: machineColumnMappingSchema,
  rows: z.array(
    z.object({
      line: z.number(),
      builder: z.string(),
      model: z.string(),
      serialNumber: z.string().nullable(),
      problems: z.array(
        z.object({ line: z.number(), column: z.string(), field: z.string(), reason: z.string() }),
      ),
    }),
  ),
  goodCount: z.number(),
  badCount: z.number(),
});
export type MachineImportPreview = z.infer<typeof machineImportPreviewSchema>;

export const machineImportReportSchema = z.object({
  imported: z.number(),
  machineIds: z.array(z.number()),
  skipped: z.array(z.object({ line: z.number(), reasons: z.array(z.string()) })),
});
export type MachineImportReport = z.infer<typeof machineImportReportSchema>;
