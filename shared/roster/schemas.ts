import { z } from "zod";
import { idParam } from "../credentials/schemas.ts";
import { standings, type Standing } from "../standing/standing-types.ts";

export const rosterEntryParamsSchema = z.object({ entryId: idParam });

/** A technician, or a whole service company (all its technicians, present and future): exactly one of the two. */
export const addRosterEntrySchema = z
  .object({ technicianId: idParam.optional(), serviceCompanyId: idParam.optional() })
  .refine((v) => (v.technicianId === undefined) !== (v.serviceCompanyId === undefined), {
    message: "Give either a technician or a service company",
    path: ["technicianId"],
  });
export type AddRosterEntry = z.infer<typeof addRosterEntrySchema>;

/** Days before a lapse at which a rostered technician raises an alert to the shop: a month's notice (common practice). */
export const ROSTER_LAPSE_ALERT_DAYS = 30;

export const rosterAlertEvents = ["stopped_clearing", "lapse_within_30_days"] as const;
export type RosterAlertEvent = (typeof rosterAlertEvents)[number];

export const rosterTechnicianDtoSchema = z.object({
  technicianId: z.number(),
  name: z.string(),
  companyId: z.number(),
  companyName: z.string(),
  active: z.boolean(),
  /** Stored baseline standing; null until the standing job has computed one. */
  standing: z.enum(standings).nullable(),
  nextLapse: z.string().nullable(),
});
export type RosterTechnicianDto = z.infer<typeof rosterTechnicianDtoSchema>;

export const rosterEntryDtoSchema = z.object({
  id: z.number(),
  kind: z.enum(["technician", "company"]),
  technicianId: z.number().nullable(),
  serviceCompanyId: z.number().nullable(),
  /** The technician's or the company's name. */
  name: z.string(),
  companyName: z.string(),
  addedAt: z.string(),
  /** One for a technician entry; every technician of the company for a company entry. */
  technicians: z.array(rosterTechnicianDtoSchema),
});
export type RosterEntryDto = z.infer<typeof rosterEntryDtoSchema>;

export const rosterCsvColumns = ["technician", "company", "standing", "next lapse", "added at"] as const;

export const standingWords: Record<Standing, string> = {
  cleared: "Cleared",
  lapsing: "Lapsing",
  not_cleared: "Not cleared",
};
