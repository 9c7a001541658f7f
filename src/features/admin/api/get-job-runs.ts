import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";

export const jobRunKeys = {
  all: ["job-runs"] as const,
  list: () => [...jobRunKeys.all, "list"] as const,
};

// Run-time check of shared/standing/schemas.ts JobRunDto; `counts` differs by job, so it stays open.
export const jobRunSchema = z.object({
  id: z.number(),
  job: z.string(),
  asOf: z.string(),
  startedAt: z.string(),
  finishedAt: z.string().nullable(),
  counts: z.record(z.string(), z.unknown()),
  attempt: z.number(),
  error: z.string().nullable(),
  startedBy: z.object({ id: z.number(), name: z.string() }).nullable(),
});
export type JobRun = z.infer<typeof jobRunSchema>;

export const getJobRuns = () => api.get("/admin/job-runs", z.array(jobRunSchema));

export const jobRunsQuery = () =>
  queryOptions({ queryKey: jobRunKeys.list(), queryFn: getJobRuns, staleTime: 0 });

export const useJobRuns = () => useQuery(jobRunsQuery());
