import { z } from "zod";
import { multiLineText, singleLineText } from "../api/text.ts";
import { idParam } from "../credentials/schemas.ts";
import { isoDateSchema } from "../credentials/credential-fields.ts";
import type { PlanDue } from "./maintenance-due.ts";

export const maintenanceIntervalKinds = ["months", "hours"] as const;
export type MaintenanceIntervalKind = (typeof maintenanceIntervalKinds)[number];

export const machineParamsSchema = z.object({ machineId: idParam });
export const maintenancePlanParamsSchema = z.object({ machineId: idParam, planId: idParam });

// A ten-year overhaul is the longest calendar interval a shop plans this way; 100,000 h is decades of running.
const MAX_INTERVAL_MONTHS = 120;
const MAX_INTERVAL_HOURS = 100_000;
const MAX_METER_HOURS = 2_000_000;

/** A plan is either calendar-based (every N months from the last service date) or meter-based (every N running hours). */
export const maintenancePlanInputSchema = z
  .object({
    name: singleLineText().trim().min(2, "Name the work (at least 2 characters)").max(160),
    intervalKind: z.enum(maintenanceIntervalKinds),
    intervalMonths: z.number().int().min(1).max(MAX_INTERVAL_MONTHS).optional(),
    intervalHours: z.number().int().min(1).max(MAX_INTERVAL_HOURS).optional(),
    lastDoneOn: isoDateSchema.optional(),
    lastDoneHours: z.number().int().min(0).max(MAX_METER_HOURS).optional(),
  })
  .superRefine((v, ctx) => {
    const need = (path: string, message: string) => ctx.addIssue({ code: "custom", path: [path], message });
    if (v.intervalKind === "months") {
      if (v.intervalMonths === undefined) need("intervalMonths", "required for a plan in months");
      if (!v.lastDoneOn) need("lastDoneOn", "required for a plan in months: when was it last done?");
      if (v.intervalHours !== undefined) need("intervalHours", "only for a plan in running hours");
    } else {
      if (v.intervalHours === undefined) need("intervalHours", "required for a plan in running hours");
      if (v.lastDoneHours === undefined)
        need("lastDoneHours", "required for a plan in running hours: the meter reading when last done");
      if (v.intervalMonths !== undefined) need("intervalMonths", "only for a plan in months");
    }
  });
export type MaintenancePlanInput = z.infer<typeof maintenancePlanInputSchema>;

export const hourReadingInputSchema = z.object({
  hours: z.number().int().min(0).max(MAX_METER_HOURS),
  /** The date the meter was read at the site; today there when left out. */
  readOn: isoDateSchema.optional(),
});
export type HourReadingInput = z.infer<typeof hourReadingInputSchema>;

/** Everything is filled in from the plan; the buyer may still move the window or pick a requirement set. */
export const maintenanceRequestInputSchema = z
  .object({
    windowStart: isoDateSchema.optional(),
    windowEnd: isoDateSchema.optional(),
    requirementSetId: idParam.nullable().optional(),
    note: multiLineText().trim().max(2000).optional(),
  })
  .superRefine((v, ctx) => {
    if (v.windowStart && v.windowEnd && v.windowEnd < v.windowStart)
      ctx.addIssue({ code: "custom", path: ["windowEnd"], message: "must not be before the start" });
  });
export type MaintenanceRequestInput = z.infer<typeof maintenanceRequestInputSchema>;

// Response shapes, declared once: the server's types and the client's parsing both come from these.
export const planDueSchema = z.object({
  dueOn: z.string().nullable(),
  estimated: z.boolean(),
  dueHours: z.number().nullable(),
  currentHours: z.number().nullable(),
  daysUntil: z.number().nullable(),
  state: z.enum(["scheduled", "coming_due", "due_soon", "due_now", "overdue"]),
  dueKey: z.string(),
}) satisfies z.ZodType<PlanDue>;

export const maintenanceRequestRefSchema = z.object({
  serviceRequestId: z.number(),
  status: z.string(),
  windowStart: z.string(),
  windowEnd: z.string(),
  createdAt: z.string(),
});
export type MaintenanceRequestRefDto = z.infer<typeof maintenanceRequestRefSchema>;

export const maintenancePlanSchema = z.object({
  id: z.number(),
  machineId: z.number(),
  name: z.string(),
  intervalKind: z.enum(maintenanceIntervalKinds),
  intervalMonths: z.number().nullable(),
  intervalHours: z.number().nullable(),
  lastDoneOn: z.string().nullable(),
  lastDoneHours: z.number().nullable(),
  due: planDueSchema,
  /** The instant the due date begins at the machine's site, for a reader in another zone. */
  dueStartsAt: z.string().nullable(),
  /** The request raised for the current due occurrence and not yet done, if any. */
  openRequest: maintenanceRequestRefSchema.nullable(),
  updatedAt: z.string(),
});
export type MaintenancePlanDto = z.infer<typeof maintenancePlanSchema>;

export const maintenancePlanListSchema = z.object({
  machineId: z.number(),
  machine: z.object({
    builder: z.string(),
    model: z.string(),
    serialNumber: z.string().nullable(),
    siteName: z.string(),
  }),
  /** The site's calendar date the due days are counted from. */
  today: z.string(),
  siteTimeZone: z.string(),
  latestReading: z.object({ hours: z.number(), readOn: z.string(), recordedAt: z.string() }).nullable(),
  plans: z.array(maintenancePlanSchema),
});
export type MaintenancePlanListDto = z.infer<typeof maintenancePlanListSchema>;

export const raisedMaintenanceRequestSchema = z.object({
  serviceRequestId: z.number(),
  windowStart: z.string(),
  windowEnd: z.string(),
});
export type RaisedMaintenanceRequestDto = z.infer<typeof raisedMaintenanceRequestSchema>;

export const dueStateWords: Record<PlanDue["state"], string> = {
  scheduled: "Scheduled",
  coming_due: "Coming due",
  due_soon: "Due soon",
  due_now: "Due now",
  overdue: "Overdue",
};
