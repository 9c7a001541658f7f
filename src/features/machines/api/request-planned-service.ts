import { useMutation, useQueryClient } from "@tanstack/react-query";
import { raisedMaintenanceRequestSchema } from "@shared/machines/maintenance-schemas.ts";
import { api } from "@/lib/api-client.ts";
import { maintenanceKeys } from "./maintenance-keys.ts";

/** One click: the server fills in the machine, the kind, the planned state and the window from the plan. */
export const requestPlannedService = ({ machineId, planId }: { machineId: number; planId: number }) =>
  api.post(
    `/machines/${machineId}/maintenance-plans/${planId}/service-request`,
    {},
    raisedMaintenanceRequestSchema,
  );

export function useRequestPlannedService(machineId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: requestPlannedService,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: maintenanceKeys.plans(machineId) }),
  });
}
