import { useMutation, useQueryClient } from "@tanstack/react-query";
import { maintenancePlanListSchema, type HourReadingInput } from "@shared/machines/maintenance-schemas.ts";
import { api } from "@/lib/api-client.ts";
import { maintenanceKeys } from "./maintenance-keys.ts";

export const recordHourReading = ({ machineId, input }: { machineId: number; input: HourReadingInput }) =>
  api.post(`/machines/${machineId}/hour-readings`, input, maintenancePlanListSchema);

export function useRecordHourReading(machineId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: recordHourReading,
    onSuccess: (list) => queryClient.setQueryData(maintenanceKeys.plans(machineId), list),
  });
}
