import { queryOptions } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { machineKeys } from "./machine-keys.ts";
import { machineHistorySchema } from "./machine-shapes.ts";

export const getMachineHistory = (id: number) => api.get(`/machines/${id}/history`, machineHistorySchema);

export const machineHistoryQuery = (id: number) =>
  queryOptions({ queryKey: machineKeys.history(id), queryFn: () => getMachineHistory(id) });
