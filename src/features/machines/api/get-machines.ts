import { queryOptions } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";
import { machineKeys, type MachineFilters } from "./machine-keys.ts";
import { machineDtoSchema } from "@shared/sites/schemas.ts";

export const getMachines = (filters: MachineFilters) => {
  const query = new URLSearchParams();
  for (const [key, value] of Object.entries(filters)) {
    if (value !== undefined && value !== "") query.set(key, String(value));
  }
  const search = query.toString();
  return api.get(`/machines${search ? `?${search}` : ""}`, z.array(machineDtoSchema));
};

export const machinesQuery = (filters: MachineFilters) =>
  queryOptions({ queryKey: machineKeys.list(filters), queryFn: () => getMachines(filters) });
