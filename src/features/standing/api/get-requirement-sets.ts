import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";
import { requirementSetKeys } from "./requirement-set-keys.ts";
import { requirementSetDtoSchema } from "@shared/standing/schemas.ts";

export const getRequirementSets = () => api.get("/requirement-sets", z.array(requirementSetDtoSchema));

export const requirementSetsQuery = () =>
  queryOptions({ queryKey: requirementSetKeys.list(), queryFn: getRequirementSets });

export const useRequirementSets = () => useQuery(requirementSetsQuery());
