import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";
import { machineKeys } from "./machine-keys.ts";

const entrySchema = z.object({
  id: z.number(),
  name: z.string(),
  aliases: z.array(z.string()),
  active: z.boolean(),
});

export const getBuilderCatalog = () => api.get("/machine-catalog?kind=builder", z.array(entrySchema));

export const builderCatalogQuery = () =>
  queryOptions({ queryKey: machineKeys.builders(), queryFn: getBuilderCatalog, staleTime: 5 * 60_000 });

/** The catalog's builders, offered as suggestions; the list still matches any name or alias typed. */
export const useBuilderCatalog = () => useQuery(builderCatalogQuery());
