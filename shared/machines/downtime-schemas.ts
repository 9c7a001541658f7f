import { z } from "zod";

/** What a shop may say about a machine from its page: it stopped, or it runs again. */
export const machineRunningStates = ["down", "running"] as const;

/**
 * Marking a machine down or running by hand. `at` lets the shop say when it happened (a mill that stopped on the night
 * shift is marked in the morning); without it, now.
 */
export const markMachineStateSchema = z.object({
  state: z.enum(machineRunningStates),
  at: z.iso.datetime({ offset: true }).optional(),
});
export type MarkMachineState = z.infer<typeof markMachineStateSchema>;

const downtimeCause = z.enum(["hand", "service_request", "work_order"]);

export const machineDowntimeSchema = z.object({
  machineId: z.number(),
  /** The site's zone, in which the months are cut. */
  timeZone: z.string(),
  months: z.array(z.object({ month: z.string().regex(/^\d{4}-\d{2}$/), hours: z.number().nonnegative() })),
  totalHours: z.number().nonnegative(),
  periods: z.number().int().nonnegative(),
  medianHoursToRestore: z.number().nonnegative().nullable(),
  downSince: z.string().nullable(),
  /** The periods of the charted months, newest first. */
  recent: z.array(
    z.object({
      id: z.number(),
      startedAt: z.string(),
      endedAt: z.string().nullable(),
      openedBy: downtimeCause,
      closedBy: z.enum(["hand", "confirmation"]).nullable(),
      serviceRequestId: z.number().nullable(),
      workOrderId: z.number().nullable(),
    }),
  ),
  companies: z.array(
    z.object({
      companyId: z.number(),
      companyName: z.string(),
      workOrders: z.number().int().positive(),
      medianResponseHours: z.number().nonnegative().nullable(),
      medianRepairHours: z.number().nonnegative().nullable(),
    }),
  ),
});
export type MachineDowntimeDto = z.infer<typeof machineDowntimeSchema>;
