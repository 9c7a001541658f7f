import { z } from "zod";

// Run-time check of shared/technicians/schemas.ts TechnicianDto (declared there as an interface).
export const technicianSchema = z.object({
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
export type Technician = z.infer<typeof technicianSchema>;
