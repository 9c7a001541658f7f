import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { jobRunDtoSchema, type JobRunDto } from "@shared/standing/schemas.ts";
import { api } from "@/lib/api-client.ts";

export const jobRunKeys = {
  all: ["job-runs"] as const,
  list: () => [...jobRunKeys.all, "list"] as const,
};

export type JobRun = JobRunDto;

export const getJobRuns = () => api.get("/admin/job-runs", z.array(jobRunDtoSchema));

export const jobRunsQuery = () =>
  queryOptions({ queryKey: jobRunKeys.list(), queryFn: getJobRuns, staleTime: 0 });

export const useJobRuns = () => useQuery(jobRunsQuery());
