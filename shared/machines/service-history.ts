import { z } from "zod";
import { multiLineText, singleLineText } from "../api/text.ts";
import { isoDateSchema } from "../credentials/credential-fields.ts";
import { requestKinds, type RequestKind } from "../service-requests/schemas.ts";
import { standingSnapshotSchema } from "../work-orders/standing-snapshot.ts";

/** The kinds of work a history entry records: the same words as a service request. */
export const workKinds = requestKinds;
export type WorkKind = RequestKind;

/**
 * Where on the machine the trouble was. Repeat faults are matched on this, not on free text, because two people
 * describe the same spindle fault in different words.
 */
export const problemAreas = [
  "spindle",
  "axes_and_drives",
  "tool_changer",
  "control_and_electrical",
  "hydraulics_and_lube",
  "coolant_and_chips",
  "accuracy_and_alignment",
  "other",
] as const;
export type ProblemArea = (typeof problemAreas)[number];
export const problemAreaLabels: Record<ProblemArea, string> = {
  spindle: "Spindle",
  axes_and_drives: "Axes and drives",
  tool_changer: "Tool changer",
  control_and_electrical: "Control and electrical",
  hydraulics_and_lube: "Hydraulics and lubrication",
  coolant_and_chips: "Coolant and chips",
  accuracy_and_alignment: "Accuracy and alignment",
  other: "Other",
};

export const partUsedSchema = z.object({
  description: singleLineText().trim().min(1, "Name the part").max(200),
  partNumber: singleLineText().trim().max(80).nullable().optional(),
  quantity: z.number().int().min(1, "At least 1").max(9999).default(1),
});
export type PartUsed = z.infer<typeof partUsedSchema>;
/** A part as an answer carries it: stored parts are read back as they were saved, without the input's limits. */
export const partUsedDtoSchema = z.object({
  description: z.string(),
  // Parts saved without a number carry none, or null.
  partNumber: z.string().nullable().optional(),
  quantity: z.number(),
});
export const MAX_PARTS_USED = 50;
export const partsUsedSchema = z.array(partUsedSchema).max(MAX_PARTS_USED, `At most ${MAX_PARTS_USED} parts`);

/**
 * Parts typed one a line, as people write them on a job sheet: "2 × Way wiper, WW-220", "2x Way wiper" or just
 * "Way wiper" (one). The result still goes through `partsUsedSchema`.
 */
export function readPartLines(
  text: string,
): { description: string; partNumber: string | null; quantity: number }[] {
  return text
    .split("\n")
    .map((line) => line.trim())
    .filter(Boolean)
    .map((line) => {
      const counted = /^(\d+)\s*[x×]\s*(.+)$/i.exec(line);
      const rest = counted ? counted[2]! : line;
      const comma = rest.lastIndexOf(",");
      const description = (comma > 0 ? rest.slice(0, comma) : rest).trim();
      const partNumber = comma > 0 ? rest.slice(comma + 1).trim() || null : null;
      return { description, partNumber, quantity: counted ? Number(counted[1]) : 1 };
    });
}

// Hours are kept to 2 decimals, like a work order's.
const hoursSchema = z.number().min(0).max(999).multipleOf(0.01);

/** Work a shop records itself (done before the platform, or by someone not on it). It never counts toward ratings. */
export const recordShopServiceSchema = z.object({
  performedOn: isoDateSchema,
  kind: z.enum(workKinds),
  problemArea: z.enum(problemAreas).nullable().optional(),
  serviceCompanyName: singleLineText().trim().max(160).nullable().optional(),
  technicianName: singleLineText().trim().max(160).nullable().optional(),
  hoursOnSite: hoursSchema.nullable().optional(),
  travelHours: hoursSchema.nullable().optional(),
  note: multiLineText().trim().min(3, "Say what was done (at least 3 characters)").max(5000),
  partsUsed: partsUsedSchema.default([]),
});
export type RecordShopService = z.infer<typeof recordShopServiceSchema>;

export const historySources = ["platform", "shop_record"] as const;
export type HistorySource = (typeof historySources)[number];
export const historySourceLabels: Record<HistorySource, string> = {
  platform: "Work order on Clearbench",
  shop_record: "Recorded by the shop",
};

export const historyAttachmentDtoSchema = z.object({
  documentId: z.number(),
  name: z.string(),
  mime: z.string(),
  sizeBytes: z.number(),
  url: z.string(),
});
export type HistoryAttachmentDto = z.infer<typeof historyAttachmentDtoSchema>;

export const historyEntryDtoSchema = z.object({
  /** "wo-12" or "rec-4": unique across both sources. */
  key: z.string(),
  source: z.enum(historySources),
  workOrderId: z.number().nullable(),
  /** The calendar day of the work at the site (YYYY-MM-DD). */
  date: z.string(),
  kind: z.enum(workKinds).nullable(),
  problemArea: z.enum(problemAreas).nullable(),
  serviceCompanyName: z.string().nullable(),
  technicianName: z.string().nullable(),
  hoursOnSite: z.number().nullable(),
  travelHours: z.number().nullable(),
  /** What was done: the completion note, or the shop's own words. */
  note: z.string().nullable(),
  /** The problem as the shop described it when raising the work order. */
  problem: z.string().nullable(),
  partsUsed: z.array(partUsedDtoSchema),
  attachments: z.array(historyAttachmentDtoSchema),
  /** The technician's standing when the work was completed (platform entries only). */
  standingSnapshot: standingSnapshotSchema.nullable(),
  /** Set when the same kind of problem came back within the repeat window: the key of the earlier entry. */
  repeatOf: z.string().nullable(),
});
export type HistoryEntryDto = z.infer<typeof historyEntryDtoSchema>;

export const machineHistoryDtoSchema = z.object({
  machineId: z.number(),
  entries: z.array(historyEntryDtoSchema),
});
export type MachineHistoryDto = z.infer<typeof machineHistoryDtoSchema>;

/** A repeat fault: the same problem back on the same machine within this many days (common practice in maintenance). */
export const REPEAT_FAULT_WINDOW_DAYS = 90;

export interface FaultCandidate {
  key: string;
  date: string;
  kind: WorkKind | null;
  problemArea: ProblemArea | null;
}

const dayNumber = (isoDate: string) => Date.parse(`${isoDate}T00:00:00Z`) / 86_400_000;

/** A fault is a repair with a named area; planned work, installations and "other" are not compared. */
const isComparableFault = (e: FaultCandidate) =>
  e.kind === "repair" && e.problemArea !== null && e.problemArea !== "other";

/**
 * For each entry of one machine's history, the key of the latest earlier repair in the same problem area at most
 * REPEAT_FAULT_WINDOW_DAYS calendar days before it (day 90 counts, day 91 does not), or null.
 */
export function findRepeatFaults(entries: readonly FaultCandidate[]): Map<string, string | null> {
  const ordered = [...entries].sort((a, b) => a.date.localeCompare(b.date) || a.key.localeCompare(b.key));
  const lastByArea = new Map<ProblemArea, FaultCandidate>();
  const result = new Map<string, string | null>(entries.map((e) => [e.key, null]));
  for (const entry of ordered) {
    if (!isComparableFault(entry)) continue;
    const area = entry.problemArea!;
    const earlier = lastByArea.get(area);
    if (earlier && dayNumber(entry.date) - dayNumber(earlier.date) <= REPEAT_FAULT_WINDOW_DAYS) {
      result.set(entry.key, earlier.key);
    }
    lastByArea.set(area, entry);
  }
  return result;
}

export const historyCsvColumns = [
  "Date",
  "Source",
  "Work order",
  "Kind of work",
  "Problem area",
  "Repeat fault",
  "Service company",
  "Technician",
  "Hours on site",
  "Travel hours",
  "What was done",
  "Parts used",
  "Attachments",
  "Standing at completion",
] as const;
