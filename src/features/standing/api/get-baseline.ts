import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { requirementSchema } from "@shared/standing/requirements.ts";
import { api } from "@/lib/api-client.ts";
import { baselineKeys } from "./baseline-keys.ts";

// Run-time check of shared/standing/schemas.ts BaselineDto.
export const baselineSchema = z.object({
  requirements: z.array(requirementSchema),
  updatedAt: z.string(),
});
export type Baseline = z.infer<typeof baselineSchema>;

export const getBaseline = () => api.get("/baseline", baselineSchema);

export const baselineQuery = () => queryOptions({ queryKey: baselineKeys.current(), queryFn: getBaseline });

export const useBaseline = () => useQuery(baselineQuery());
