import { z } from "zod";
import { singleLineText } from "../api/text.ts";
import { isoDateSchema } from "../credentials/credential-fields.ts";

/** A zone the IANA time zone database knows; anything else would silently shift every day boundary. */
export function isKnownTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat("en-US", { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

const id = z.coerce.number().int().positive();

/**
 * Filters on the gate check log. `from` and `to` are calendar days in the reader's zone (both included), so a check at
 * 11:30 p.m. in Chicago belongs to that evening's day and not to the next one already begun in UTC.
 */
export const gateCheckLogQuerySchema = z
  .object({
    from: isoDateSchema.optional(),
    to: isoDateSchema.optional(),
    siteId: id.optional(),
    technicianId: id.optional(),
    timeZone: singleLineText()
      .trim()
      .max(64)
      .refine(isKnownTimeZone, "Not a time zone of the IANA database")
      .optional(),
  })
  .refine((q) => !q.from || !q.to || q.from <= q.to, { message: "Must not be after to", path: ["from"] });
export type GateCheckLogQuery = z.infer<typeof gateCheckLogQuerySchema>;

/** The most rows one page of the log shows; narrower filters find older checks. */
export const GATE_CHECK_LOG_LIMIT = 200;

export const gateCheckRecordSchema = z.object({
  id: z.number(),
  technicianId: z.number(),
  technicianName: z.string(),
  /** The technician's company, for the shop; the service side knows its own. */
  companyName: z.string(),
  siteId: z.number().nullable(),
  siteName: z.string().nullable(),
  /** The shop whose site it was, for the service side; null when scanned without a gate sign. */
  shopName: z.string().nullable(),
  state: z.enum(["cleared", "not_cleared"]),
  checkedAt: z.string(),
});
export type GateCheckRecord = z.infer<typeof gateCheckRecordSchema>;

export const gateCheckLogSchema = z.object({
  /** The zone the day filters were read in, and the one to show times in. */
  timeZone: z.string(),
  checks: z.array(gateCheckRecordSchema),
  /** What the filters may choose from: only sites and technicians this reader already sees in its own log. */
  sites: z.array(z.object({ id: z.number(), name: z.string() })),
  technicians: z.array(z.object({ id: z.number(), name: z.string() })),
  truncated: z.boolean(),
});
export type GateCheckLog = z.infer<typeof gateCheckLogSchema>;
