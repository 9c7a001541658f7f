import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { directoryKeys } from "./directory-keys.ts";
import { directoryTechnicianSchema } from "./directory-shapes.ts";

export const getDirectoryTechnician = (id: number, onSiteHours: number) =>
  api.get(`/directory/technicians/${id}?onSiteHours=${onSiteHours}`, directoryTechnicianSchema);

export const directoryTechnicianQuery = (id: number, onSiteHours = 2) =>
  queryOptions({
    queryKey: directoryKeys.technician(id, onSiteHours),
    queryFn: () => getDirectoryTechnician(id, onSiteHours),
  });

export const useDirectoryTechnician = (id: number, onSiteHours = 2) =>
  useQuery(directoryTechnicianQuery(id, onSiteHours));
