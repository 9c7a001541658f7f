import { z } from "zod";
import { machineStates } from "@shared/sites/schemas.ts";
import { machineTechnologies } from "@shared/technicians/schemas.ts";
import { historySources, problemAreas, workKinds } from "@shared/machines/service-history.ts";
import { standings } from "@shared/standing/standing-types.ts";

// Run-time checks of shared/sites/schemas.ts EquipmentDto (with its site) and shared/machines/service-history.ts.
export const machineSchema = z.object({
  id: z.number(),
  siteId: z.number(),
  siteName: z.string(),
  builder: z.string(),
  controlFamily: z.string(),
  technology: z.enum(machineTechnologies),
  model: z.string(),
  serialNumber: z.string().nullable(),
  yearBuilt: z.number().nullable().optional(),
  inServiceOn: z.string().nullable().optional(),
  building: z.string().nullable().optional(),
  bay: z.string().nullable().optional(),
  notes: z.string().nullable().optional(),
  state: z.enum(machineStates).optional(),
});
export type Machine = z.infer<typeof machineSchema>;

const partSchema = z.object({
  description: z.string(),
  partNumber: z.string().nullable().optional(),
  quantity: z.number(),
});

export const historyEntrySchema = z.object({
  key: z.string(),
  source: z.enum(historySources),
  workOrderId: z.number().nullable(),
  date: z.string(),
  kind: z.enum(workKinds).nullable(),
  problemArea: z.enum(problemAreas).nullable(),
  serviceCompanyName: z.string().nullable(),
  technicianName: z.string().nullable(),
  hoursOnSite: z.number().nullable(),
  travelHours: z.number().nullable(),
  note: z.string().nullable(),
  problem: z.string().nullable(),
  partsUsed: z.array(partSchema),
  attachments: z.array(
    z.object({
      documentId: z.number(),
      name: z.string(),
      mime: z.string(),
      sizeBytes: z.number(),
      url: z.string(),
    }),
  ),
  // Only the overall answer is shown here; the work order's own page shows the snapshot in full.
  standingSnapshot: z.object({ takenAt: z.string(), standing: z.enum(standings) }).nullable(),
  repeatOf: z.string().nullable(),
});
export type HistoryEntry = z.infer<typeof historyEntrySchema>;

export const machineHistorySchema = z.object({
  machineId: z.number(),
  entries: z.array(historyEntrySchema),
});
export type MachineHistory = z.infer<typeof machineHistorySchema>;
