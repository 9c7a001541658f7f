import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";
import { rosterKeys } from "./roster-keys.ts";
import { rosterEntryDtoSchema } from "@shared/roster/schemas.ts";

export const getRoster = () => api.get("/roster", z.array(rosterEntryDtoSchema));

export const rosterQuery = () => queryOptions({ queryKey: rosterKeys.list(), queryFn: getRoster });

export const useRoster = () => useQuery(rosterQuery());
