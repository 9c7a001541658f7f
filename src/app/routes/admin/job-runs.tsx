import { useSuspenseQuery } from "@tanstack/react-query";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { jobRunsQuery } from "@/features/admin/api/get-job-runs.ts";
import { useRunDailyJob } from "@/features/admin/api/run-daily-job.ts";
import { JobRunsTable } from "@/features/admin/components/job-runs-table.tsx";
import { formatDateTime } from "@/lib/format-date-time.ts";
import { queryClient } from "@/lib/query-client.ts";

export async function loader() {
  await queryClient.ensureQueryData(jobRunsQuery());
  return null;
}

export function Component() {
  const { data: runs, refetch, isFetching } = useSuspenseQuery(jobRunsQuery());
  const runNow = useRunDailyJob();
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
      <section
        aria-labelledby="run-now-heading"
        className="mb-6 space-y-2 rounded-lg border border-ink-100 bg-white p-4"
      >
        <h2 id="run-now-heading" className="font-semibold text-ink-900">
          Run the daily job now
        </h2>
        <p className="text-sm text-ink-700">
          Lapses what has ended, sends the due warnings and refreshes standings, as of this moment. Only today
          can be judged: a past or future date would lapse or warn on the wrong day. The run is listed below
          as yours.
        </p>
        <FormError error={runNow.error} />
        <Button pending={runNow.isPending} pendingLabel="Running…" onClick={() => runNow.mutate()}>
          Run the daily job now
        </Button>
        {runNow.data && (
          <p role="status" className="text-sm text-ink-900">
            Ran as of {formatDateTime(runNow.data.asOf)}: {runNow.data.lapsed} lapsed,{" "}
            {runNow.data.noticesCreated} notices, {runNow.data.emailsQueued} e-mails queued,{" "}
            {runNow.data.changedStandings} standings changed.
          </p>
        )}
      </section>
      <JobRunsTable runs={runs} />
    </>
  );
}
