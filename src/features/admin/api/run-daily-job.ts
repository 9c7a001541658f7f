import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";
import { jobRunKeys } from "./get-job-runs.ts";

const manualRunSchema = z.object({
  jobRunId: z.number(),
  asOf: z.string(),
  lapsed: z.number(),
  noticesCreated: z.number(),
  emailsQueued: z.number(),
  changedStandings: z.number(),
});
export type ManualRun = z.infer<typeof manualRunSchema>;

/** The daily lapse round, judged as of now (the server's clock; no other day can be chosen). */
export const runDailyJob = () => api.post("/admin/job-runs/lapse", {}, manualRunSchema);

export function useRunDailyJob() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: runDailyJob,
    onSettled: () => queryClient.invalidateQueries({ queryKey: jobRunKeys.all }),
  });
}
