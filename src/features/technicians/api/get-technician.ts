import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { technicianKeys } from "./technician-keys.ts";
import { technicianDtoSchema } from "@shared/technicians/schemas.ts";

// The service company's own pages read every field: the full member of the route's technicianViewDtoSchema.
// The service company's own pages read every field: the full member of the route's technicianViewDtoSchema.
export const getTechnician = (id: number) => api.get(`/technicians/${id}`, technicianDtoSchema);

export const technicianQuery = (id: number) =>
  queryOptions({ queryKey: technicianKeys.detail(id), queryFn: () => getTechnician(id) });

export const useTechnician = (id: number) => useQuery(technicianQuery(id));
