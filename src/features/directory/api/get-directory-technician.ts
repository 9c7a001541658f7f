import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { directoryKeys } from "./directory-keys.ts";
import { directoryTechnicianDtoSchema } from "@shared/directory/directory-shapes.ts";
import { DEFAULT_ON_SITE_HOURS } from "@shared/directory/call-out-estimate.ts";

/** The estimate inputs carried from the directory: hours on site and, when chosen, the site. */
export interface EstimateInputs {
  onSiteHours: number;
  siteId: number | null;
}

const DEFAULT_INPUTS: EstimateInputs = { onSiteHours: DEFAULT_ON_SITE_HOURS, siteId: null };

/** Reads the carried inputs from a page address; anything unusable falls back to the directory's own default. */
export function estimateInputsOf(search: URLSearchParams): EstimateInputs {
  const hours = Number(search.get("onSiteHours"));
  const siteId = Number(search.get("siteId"));
  return {
    onSiteHours:
      search.get("onSiteHours") && Number.isFinite(hours) && hours >= 0 && hours <= 24
        ? hours
        : DEFAULT_INPUTS.onSiteHours,
    siteId: Number.isInteger(siteId) && siteId > 0 ? siteId : null,
  };
}

export const getDirectoryTechnician = (id: number, inputs: EstimateInputs) => {
  const query = new URLSearchParams({ onSiteHours: String(inputs.onSiteHours) });
  if (inputs.siteId !== null) query.set("siteId", String(inputs.siteId));
  return api.get(`/directory/technicians/${id}?${query.toString()}`, directoryTechnicianDtoSchema);
};

export const directoryTechnicianQuery = (id: number, inputs: EstimateInputs = DEFAULT_INPUTS) =>
  queryOptions({
    queryKey: directoryKeys.technician(id, inputs.onSiteHours, inputs.siteId),
    queryFn: () => getDirectoryTechnician(id, inputs),
  });

export const useDirectoryTechnician = (id: number, inputs: EstimateInputs = DEFAULT_INPUTS) =>
  useQuery(directoryTechnicianQuery(id, inputs));
