import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { CatalogEntryInput } from "@shared/machines/catalog.ts";
import { api } from "@/lib/api-client.ts";
import { catalogEntryDtoSchema } from "@shared/machines/catalog.ts";
import { machineCatalogKeys } from "@/lib/machine-catalog.ts";

export const addCatalogEntry = (input: CatalogEntryInput) =>
  api.post("/machine-catalog", input, catalogEntryDtoSchema);

export const editCatalogEntry = ({ id, input }: { id: number; input: CatalogEntryInput }) =>
  api.put(`/machine-catalog/${id}`, input, catalogEntryDtoSchema);

export function useAddCatalogEntry() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addCatalogEntry,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: machineCatalogKeys.all }),
  });
}

/** Edits the name or aliases, or retires an entry (active: false) so pickers stop offering it. */
export function useEditCatalogEntry() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: editCatalogEntry,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: machineCatalogKeys.all }),
  });
}
