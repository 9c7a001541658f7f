import { useSuspenseQuery } from "@tanstack/react-query";
import { Button } from "@/components/ui/button.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { jobRunsQuery } from "@/features/job-runs/api/get-job-runs.ts";
import { JobRunsTable } from "@/features/job-runs/components/job-runs-table.tsx";
import { queryClient } from "@/lib/query-client.ts";

export async function loader() {
  await queryClient.ensureQueryData(jobRunsQuery());
  return null;
}

export function Component() {
  const { data: runs, refetch, isFetching } = useSuspenseQuery(jobRunsQuery());
  return (
    <>
      <PageHeader
        title="Job runs"
        description="Each run of the scheduled jobs: the instant it judged as of, how long it took and what it changed. A failed run is retried after 1, 5 and 15 minutes (JOB_RETRY_MINUTES); each failure is listed with its attempt and reason."
        actions={
          <Button
            variant="secondary"
            pending={isFetching}
            pendingLabel="Refreshing…"
            onClick={() => void refetch()}
          >
            Refresh
          </Button>
        }
      />
      <JobRunsTable runs={runs} />
    </>
  );
}
