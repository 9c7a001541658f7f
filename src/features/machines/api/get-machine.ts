import { queryOptions } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { machineKeys } from "./machine-keys.ts";
import { machineDtoSchema } from "@shared/sites/schemas.ts";

export const getMachine = (id: number) => api.get(`/machines/${id}`, machineDtoSchema);

export const machineQuery = (id: number) =>
  queryOptions({ queryKey: machineKeys.detail(id), queryFn: () => getMachine(id) });
