import { useMutation, useQueryClient } from "@tanstack/react-query";
import { maintenancePlanSchema, type MaintenancePlanInput } from "@shared/machines/maintenance-schemas.ts";
import { api } from "@/lib/api-client.ts";
import { maintenanceKeys } from "./maintenance-keys.ts";

type SaveMaintenancePlan = { machineId: number; planId?: number | undefined; input: MaintenancePlanInput };

/** Adds a plan to a machine, or replaces one when `planId` is given. */
export const saveMaintenancePlan = ({ machineId, planId, input }: SaveMaintenancePlan) =>
  planId
    ? api.put(`/machines/${machineId}/maintenance-plans/${planId}`, input, maintenancePlanSchema)
    : api.post(`/machines/${machineId}/maintenance-plans`, input, maintenancePlanSchema);

export function useSaveMaintenancePlan(machineId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveMaintenancePlan,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: maintenanceKeys.plans(machineId) }),
  });
}
