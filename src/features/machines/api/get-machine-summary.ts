import { queryOptions } from "@tanstack/react-query";
import { machineDtoSchema } from "@shared/sites/schemas.ts";
import { api } from "@/lib/api-client.ts";

// The transfer page names the machine by a few fields of its record, read in the record's one shape.

export const machineSummaryQuery = (machineId: number) =>
  queryOptions({
    queryKey: ["machines", "detail", machineId, "summary"] as const,
    queryFn: () => api.get(`/machines/${machineId}`, machineDtoSchema),
  });
