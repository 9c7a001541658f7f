import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { siteKeys } from "./site-keys.ts";

export const archiveSite = (siteId: number) => api.send("DELETE", `/sites/${siteId}`);

export function useArchiveSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: archiveSite,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: siteKeys.all }),
  });
}
