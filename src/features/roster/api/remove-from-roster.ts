import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { rosterKeys } from "./roster-keys.ts";

export const removeFromRoster = (entryId: number) => api.send("DELETE", `/roster/${entryId}`);

export function useRemoveFromRoster() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeFromRoster,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: rosterKeys.all }),
  });
}
