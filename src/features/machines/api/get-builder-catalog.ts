import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { catalogEntryDtoSchema } from "@shared/machines/catalog.ts";
import { api } from "@/lib/api-client.ts";
import { machineKeys } from "./machine-keys.ts";

export const getBuilderCatalog = () =>
  api.get("/machine-catalog?kind=builder", z.array(catalogEntryDtoSchema));

export const builderCatalogQuery = () =>
  queryOptions({ queryKey: machineKeys.builders(), queryFn: getBuilderCatalog, staleTime: 5 * 60_000 });

/** The catalog's builders, offered as suggestions; the list still matches any name or alias typed. */
export const useBuilderCatalog = () => useQuery(builderCatalogQuery());
