import { queryOptions } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { machineKeys } from "./machine-keys.ts";
import { machineHistoryDtoSchema } from "@shared/machines/service-history.ts";

export const getMachineHistory = (id: number) => api.get(`/machines/${id}/history`, machineHistoryDtoSchema);

export const machineHistoryQuery = (id: number) =>
  queryOptions({ queryKey: machineKeys.history(id), queryFn: () => getMachineHistory(id) });
