import { useMutation, useQueryClient } from "@tanstack/react-query";
import { siteDtoSchema, type SiteInput } from "@shared/sites/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { siteKeys } from "./site-keys.ts";

/** Adds a site, or revises one when `siteId` is given. */
export const saveSite = ({ siteId, input }: { siteId?: number | undefined; input: SiteInput }) =>
  siteId ? api.put(`/sites/${siteId}`, input, siteDtoSchema) : api.post("/sites", input, siteDtoSchema);

export function useSaveSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveSite,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: siteKeys.all }),
  });
}
