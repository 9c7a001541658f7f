import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";
import { technicianKeys } from "./technician-keys.ts";
import { technicianDtoSchema } from "@shared/technicians/schemas.ts";

export const getTechnicians = () => api.get("/technicians", z.array(technicianDtoSchema));

export const techniciansQuery = () =>
  queryOptions({ queryKey: technicianKeys.list(), queryFn: getTechnicians });

export const useTechnicians = () => useQuery(techniciansQuery());
