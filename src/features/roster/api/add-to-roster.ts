import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { AddRosterEntry } from "@shared/roster/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { rosterKeys } from "./roster-keys.ts";
import { rosterEntrySchema } from "./roster-shapes.ts";

export const addToRoster = (entry: AddRosterEntry) => api.post("/roster", entry, rosterEntrySchema);

export function useAddToRoster() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addToRoster,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: rosterKeys.all }),
  });
}
