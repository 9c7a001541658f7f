import { queryOptions } from "@tanstack/react-query";
import { maintenancePlanListSchema } from "@shared/machines/maintenance-schemas.ts";
import { api } from "@/lib/api-client.ts";

export const maintenanceKeys = {
  all: ["machines", "maintenance"] as const,
  plans: (machineId: number) => [...maintenanceKeys.all, "plans", machineId] as const,
};

export const getMaintenancePlans = (machineId: number) =>
  api.get(`/machines/${machineId}/maintenance-plans`, maintenancePlanListSchema);

export const maintenancePlansQuery = (machineId: number) =>
  queryOptions({
    queryKey: maintenanceKeys.plans(machineId),
    queryFn: () => getMaintenancePlans(machineId),
  });
