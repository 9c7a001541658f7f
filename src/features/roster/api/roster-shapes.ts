import { z } from "zod";
import { standings } from "@shared/standing/standing-types.ts";

// Run-time checks of shared/roster/schemas.ts RosterEntryDto.
const rosterTechnicianSchema = z.object({
  technicianId: z.number(),
  name: z.string(),
  companyId: z.number(),
  companyName: z.string(),
  active: z.boolean(),
  standing: z.enum(standings).nullable(),
  nextLapse: z.string().nullable(),
});

export const rosterEntrySchema = z.object({
  id: z.number(),
  kind: z.enum(["technician", "company"]),
  technicianId: z.number().nullable(),
  serviceCompanyId: z.number().nullable(),
  name: z.string(),
  companyName: z.string(),
  addedAt: z.string(),
  technicians: z.array(rosterTechnicianSchema),
});
export type RosterEntry = z.infer<typeof rosterEntrySchema>;
