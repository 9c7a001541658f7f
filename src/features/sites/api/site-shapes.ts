import { z } from "zod";
import { machineTechnologies } from "@shared/technicians/schemas.ts";

// Run-time checks of shared/sites/schemas.ts SiteDto, EquipmentDto and PostalPlaceDto.
export const siteSchema = z.object({
  id: z.number(),
  companyId: z.number(),
  name: z.string(),
  addressLine: z.string(),
  postalCode: z.string(),
  city: z.string().nullable(),
  state: z.string().nullable(),
  timeZone: z.string(),
  latitude: z.number(),
  longitude: z.number(),
  // Older answers (and other shapes) may leave these out.
  contactName: z.string().nullable().optional(),
  contactPhone: z.string().nullable().optional(),
  safetyInductionNote: z.string().nullable().optional(),
  defaultPoNumber: z.string().nullable().optional(),
  defaultNotToExceedCents: z.number().nullable().optional(),
  active: z.boolean(),
  equipmentCount: z.number(),
});
export type Site = z.infer<typeof siteSchema>;

export const equipmentSchema = z.object({
  id: z.number(),
  siteId: z.number(),
  builder: z.string(),
  controlFamily: z.string(),
  technology: z.enum(machineTechnologies),
  model: z.string(),
  serialNumber: z.string().nullable(),
  building: z.string().nullable().optional(),
  bay: z.string().nullable().optional(),
});
export type Equipment = z.infer<typeof equipmentSchema>;

export const postalPlaceSchema = z.object({
  postalCode: z.string(),
  city: z.string(),
  state: z.string(),
  latitude: z.number(),
  longitude: z.number(),
  timeZone: z.string().nullable(),
});
export type PostalPlace = z.infer<typeof postalPlaceSchema>;
