import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { catalogEntryDtoSchema, type CatalogEntryDto, type CatalogKind } from "@shared/machines/catalog.ts";
import { api } from "@/lib/api-client.ts";

/** Builders and control families every machine form picks from; read by every signed-in role. */
export const machineCatalogKeys = {
  all: ["machine-catalog"] as const,
  list: () => [...machineCatalogKeys.all, "list"] as const,
};

export type CatalogEntry = CatalogEntryDto;

export const getMachineCatalog = () => api.get("/machine-catalog", z.array(catalogEntryDtoSchema));

export const machineCatalogQuery = () =>
  queryOptions({ queryKey: machineCatalogKeys.list(), queryFn: getMachineCatalog, staleTime: 5 * 60_000 });

/** The entries of one kind that may still be chosen (a retired entry stays on old records, not in the pickers). */
export function useCatalogChoices(kind: CatalogKind): CatalogEntry[] {
  const { data } = useQuery(machineCatalogQuery());
  return (data ?? []).filter((e) => e.kind === kind && e.active);
}
