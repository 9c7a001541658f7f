import { queryOptions, useQuery } from "@tanstack/react-query";
import { baselineDtoSchema, type BaselineDto } from "@shared/standing/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { baselineKeys } from "./baseline-keys.ts";

export type Baseline = BaselineDto;

export const getBaseline = () => api.get("/baseline", baselineDtoSchema);

export const baselineQuery = () => queryOptions({ queryKey: baselineKeys.current(), queryFn: getBaseline });

export const useBaseline = () => useQuery(baselineQuery());
