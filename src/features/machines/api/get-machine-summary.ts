import { queryOptions } from "@tanstack/react-query";
import { z } from "zod";
import { machineTechnologies } from "@shared/technicians/schemas.ts";
import { api } from "@/lib/api-client.ts";

/** The few fields of the machine record the transfer page names the machine by. */
const machineSummarySchema = z.object({
  id: z.number(),
  builder: z.string(),
  model: z.string(),
  controlFamily: z.string(),
  technology: z.enum(machineTechnologies),
  serialNumber: z.string().nullable(),
  siteName: z.string(),
});

export const machineSummaryQuery = (machineId: number) =>
  queryOptions({
    queryKey: ["machines", "detail", machineId, "summary"] as const,
    queryFn: () => api.get(`/machines/${machineId}`, machineSummarySchema),
  });
