import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { maintenanceKeys } from "./maintenance-keys.ts";

export const removeMaintenancePlan = ({ machineId, planId }: { machineId: number; planId: number }) =>
  api.send("DELETE", `/machines/${machineId}/maintenance-plans/${planId}`);

export function useRemoveMaintenancePlan(machineId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeMaintenancePlan,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: maintenanceKeys.plans(machineId) }),
  });
}
