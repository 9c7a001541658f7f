import { queryOptions } from "@tanstack/react-query";
import { machineDowntimeSchema } from "@shared/machines/downtime-schemas.ts";
import { api } from "@/lib/api-client.ts";
import { machineKeys } from "./machine-keys.ts";

export const getMachineDowntime = (id: number) => api.get(`/machines/${id}/downtime`, machineDowntimeSchema);

export const machineDowntimeQuery = (id: number) =>
  queryOptions({ queryKey: machineKeys.downtime(id), queryFn: () => getMachineDowntime(id) });
