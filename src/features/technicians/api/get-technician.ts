import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { technicianKeys } from "./technician-keys.ts";
import { technicianSchema } from "./technician-shape.ts";

export const getTechnician = (id: number) => api.get(`/technicians/${id}`, technicianSchema);

export const technicianQuery = (id: number) =>
  queryOptions({ queryKey: technicianKeys.detail(id), queryFn: () => getTechnician(id) });

export const useTechnician = (id: number) => useQuery(technicianQuery(id));
