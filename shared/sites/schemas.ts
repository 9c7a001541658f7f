import { z } from "zod";
import { multiLineText, singleLineText } from "../api/text.ts";
import { isoDateSchema } from "../credentials/credential-fields.ts";
import { postalCodeSchema, timeZoneSchema } from "../accounts/schemas.ts";
import { idParam } from "../credentials/schemas.ts";
import { onSiteDetailsInputSchema, phoneSchema } from "../work-orders/schemas.ts";
import { machineTechnologies } from "../technicians/schemas.ts";

export const siteParamsSchema = z.object({ siteId: idParam });
export const equipmentParamsSchema = z.object({ siteId: idParam, equipmentId: idParam });
export const postalCodeParamsSchema = z.object({ code: postalCodeSchema });

/** A shop's site as the buyer's form sends it; the time zone is suggested from the ZIP code when left out. */
export const siteInputSchema = z.object({
  name: singleLineText().trim().min(2, "Name the site").max(160),
  addressLine: singleLineText().trim().min(3, "Enter the street address").max(200),
  postalCode: postalCodeSchema,
  timeZone: timeZoneSchema.optional(),
  // What a new work order for this site starts from; the buyer may change it on each one.
  contactName: singleLineText().trim().max(120).nullable().optional(),
  contactPhone: phoneSchema.or(z.literal("")).nullable().optional(),
  safetyInductionNote: multiLineText().trim().max(2000).nullable().optional(),
  defaultPoNumber: singleLineText().trim().max(40).nullable().optional(),
  defaultNotToExceedCents: onSiteDetailsInputSchema.shape.notToExceedCents.nullable(),
});
export type SiteInput = z.infer<typeof siteInputSchema>;

export const listSitesQuerySchema = z.object({
  includeArchived: z
    .enum(["true", "false"])
    .default("false")
    .transform((v) => v === "true"),
});

/** One machine at a site; picking it in the directory fills the technology and control-family filters. */
export const equipmentInputSchema = z.object({
  builder: singleLineText().trim().min(1, "Enter the machine builder").max(120),
  controlFamily: singleLineText().trim().min(1, "Enter the control family").max(120),
  technology: z.enum(machineTechnologies),
  model: singleLineText().trim().min(1, "Enter the model").max(120),
  serialNumber: singleLineText().trim().max(80).optional(),
  yearBuilt: z.number().int().min(1900, "Enter a year from 1900 on").max(2100).nullable().optional(),
  inServiceOn: isoDateSchema.nullable().optional(),
  building: singleLineText().trim().max(80).nullable().optional(),
  bay: singleLineText().trim().max(40).nullable().optional(),
  notes: multiLineText().trim().max(4000).nullable().optional(),
  state: z.enum(["running", "down", "out_of_service", "sold"]).optional(),
});
export type EquipmentInput = z.infer<typeof equipmentInputSchema>;

export const machineStates = ["running", "down", "out_of_service", "sold"] as const;
export type MachineState = (typeof machineStates)[number];

// Response shapes: the server's DTO types are inferred from these and the client parses its answers with them.

/** One machine at a site, as the site page and the machine record read it. */
export const equipmentDtoSchema = z.object({
  id: z.number(),
  siteId: z.number(),
  builder: z.string(),
  controlFamily: z.string(),
  technology: z.enum(machineTechnologies),
  model: z.string(),
  serialNumber: z.string().nullable(),
  yearBuilt: z.number().nullable(),
  inServiceOn: z.string().nullable(),
  building: z.string().nullable(),
  bay: z.string().nullable(),
  notes: z.string().nullable(),
  state: z.enum(machineStates),
});
export type EquipmentDto = z.infer<typeof equipmentDtoSchema>;

/** A machine as the shop's machine pages read it: its site's equipment row and the site's name. */
export const machineDtoSchema = equipmentDtoSchema.extend({ siteName: z.string() });
export type MachineDto = z.infer<typeof machineDtoSchema>;

export const siteDtoSchema = z.object({
  id: z.number(),
  companyId: z.number(),
  name: z.string(),
  addressLine: z.string(),
  postalCode: z.string(),
  // From the offline ZIP table: null for a code it does not hold.
  city: z.string().nullable(),
  state: z.string().nullable(),
  timeZone: z.string(),
  latitude: z.number(),
  longitude: z.number(),
  contactName: z.string().nullable(),
  contactPhone: z.string().nullable(),
  safetyInductionNote: z.string().nullable(),
  defaultPoNumber: z.string().nullable(),
  defaultNotToExceedCents: z.number().nullable(),
  active: z.boolean(),
  equipmentCount: z.number(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type SiteDto = z.infer<typeof siteDtoSchema>;

/** What an offline ZIP lookup tells the site form: the place and a suggested time zone. */
export interface PostalPlaceDto {
  postalCode: string;
  city: string;
  state: string;
  latitude: number;
  longitude: number;
  timeZone: string | null;
}
