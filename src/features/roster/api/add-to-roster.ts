import { useMutation, useQueryClient } from "@tanstack/react-query";
import { rosterEntryDtoSchema, type AddRosterEntry } from "@shared/roster/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { directoryKeys } from "@/features/directory/api/directory-keys.ts";
import { rosterKeys } from "./roster-keys.ts";

export const addToRoster = (entry: AddRosterEntry) => api.post("/roster", entry, rosterEntryDtoSchema);

export function useAddToRoster() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addToRoster,
    // The directory and the technician's page both say who is on the roster.
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: rosterKeys.all }),
        queryClient.invalidateQueries({ queryKey: directoryKeys.all }),
      ]),
  });
}
