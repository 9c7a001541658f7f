import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";
import { siteKeys } from "./site-keys.ts";
import { siteDtoSchema } from "@shared/sites/schemas.ts";

export const getSites = () => api.get("/sites", z.array(siteDtoSchema));

export const sitesQuery = () => queryOptions({ queryKey: siteKeys.list(), queryFn: getSites });

export const useSites = () => useQuery(sitesQuery());
