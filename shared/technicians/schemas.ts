import { z } from "zod";
import { singleLineText } from "../api/text.ts";
import { fieldMask } from "../api/field-mask.ts";
import { postalCodeSchema } from "../accounts/schemas.ts";
import { TECHNICIAN_FIELDS_BY_LEVEL } from "../visibility/technician-visibility.ts";

export const machineTechnologies = [
  "mill",
  "lathe",
  "mill_turn",
  "wire_edm",
  "sinker_edm",
  "grinder",
  "laser",
  "waterjet",
  "press_brake",
  "router",
] as const;
export type MachineTechnology = (typeof machineTechnologies)[number];

export const technologyLabels: Record<MachineTechnology, string> = {
  mill: "Mill",
  lathe: "Lathe",
  mill_turn: "Mill-turn",
  wire_edm: "Wire EDM",
  sinker_edm: "Sinker EDM",
  grinder: "Grinder",
  laser: "Laser",
  waterjet: "Waterjet",
  press_brake: "Press brake",
  router: "Router",
};

const money = (label: string) => z.number().int(`${label} in whole cents`).min(0).max(10_000_00);

export const technicianInputSchema = z.object({
  name: singleLineText().trim().min(2, "Enter the technician's name").max(160),
  email: z
    .email()
    .max(254)
    .optional()
    .or(z.literal("").transform(() => undefined)),
  phone: singleLineText().trim().max(40).optional(),
  technologies: z.array(z.enum(machineTechnologies)).max(10).default([]),
  controlFamilies: z.array(singleLineText().trim().min(1).max(80)).max(20).default([]),
  postalCode: postalCodeSchema,
  serviceRadiusKm: z.number().int().min(1, "At least 1 km").max(2000),
  hourlyRateCents: money("Hourly rate"),
  travelRateCents: money("Travel rate"),
  mileageRateCents: money("Mileage rate").optional(),
});
export type TechnicianInput = z.infer<typeof technicianInputSchema>;

export const technicianParamsSchema = z.object({
  technicianId: z.coerce.number().int().positive().max(2_147_483_647),
});

export const technicianDtoSchema = z.object({
  id: z.number(),
  companyId: z.number(),
  companyName: z.string(),
  name: z.string(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
  technologies: z.array(z.string()),
  controlFamilies: z.array(z.string()),
  postalCode: z.string(),
  latitude: z.number().nullable(),
  longitude: z.number().nullable(),
  serviceRadiusKm: z.number(),
  hourlyRateCents: z.number(),
  travelRateCents: z.number(),
  mileageRateCents: z.number(),
  active: z.boolean(),
  hasAccount: z.boolean(),
});
export type TechnicianDto = z.infer<typeof technicianDtoSchema>;

/**
 * One technician as the caller may see them: exactly the fields of the caller's level by the shared visibility rule
 * (the technician's own company and staff read them all, a shop only the directory or contact fields).
 */
export const technicianViewDtoSchema = z.union([
  technicianDtoSchema.strict(),
  technicianDtoSchema.pick(fieldMask(TECHNICIAN_FIELDS_BY_LEVEL.contact)).strict(),
  technicianDtoSchema.pick(fieldMask(TECHNICIAN_FIELDS_BY_LEVEL.directory)).strict(),
]);
export type TechnicianViewDto = z.infer<typeof technicianViewDtoSchema>;
