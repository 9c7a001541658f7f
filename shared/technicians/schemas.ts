import { z } from "zod";
import { singleLineText } from "../api/text.ts";
import { postalCodeSchema } from "../accounts/schemas.ts";

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

export interface TechnicianDto {
  id: number;
  companyId: number;
  companyName: string;
  name: string;
  email: string | null;
  phone: string | null;
  technologies: string[];
  controlFamilies: string[];
  postalCode: string;
  latitude: number | null;
  longitude: number | null;
  serviceRadiusKm: number;
  hourlyRateCents: number;
  travelRateCents: number;
  mileageRateCents: number;
  active: boolean;
  hasAccount: boolean;
}
