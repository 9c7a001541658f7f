import { useMutation, useQueryClient } from "@tanstack/react-query";
import { manualJobRunDtoSchema } from "@shared/standing/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { jobRunKeys } from "./get-job-runs.ts";

export type { ManualJobRunDto as ManualRun } from "@shared/standing/schemas.ts";

/** The daily lapse round, judged as of now (the server's clock; no other day can be chosen). */
export const runDailyJob = () => api.post("/admin/job-runs/lapse", {}, manualJobRunDtoSchema);

export function useRunDailyJob() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: runDailyJob,
    onSettled: () => queryClient.invalidateQueries({ queryKey: jobRunKeys.all }),
  });
}
