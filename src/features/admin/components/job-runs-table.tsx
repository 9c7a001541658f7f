import { DataTable, dataTableColumns } from "@/components/ui/data-table.tsx";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { formatDateTime } from "@/lib/format-date-time.ts";
import type { JobRun } from "../api/get-job-runs.ts";

const jobNames: Record<string, string> = {
  lapse: "Daily lapse check",
  reviewer_digest: "Reviewer digest",
  upload_sweep: "Abandoned uploads sweep",
};

// `counts` is whatever the job recorded; a job that does not count a thing shows a dash, not a zero.
const countOf = (run: JobRun, ...keys: string[]): number | null => {
  for (const key of keys) {
    const value = run.counts[key];
    if (typeof value === "number") return value;
  }
  return null;
};

const durationMs = (run: JobRun): number | null =>
  run.finishedAt === null || run.error !== null
    ? null
    : new Date(run.finishedAt).getTime() - new Date(run.startedAt).getTime();

function formatDuration(ms: number | null): string {
  if (ms === null) return "—";
  if (ms < 1000) return `${ms} ms`;
  const seconds = ms / 1000;
  return seconds < 60
    ? `${seconds.toFixed(1)} s`
    : `${Math.floor(seconds / 60)} min ${Math.round(seconds % 60)} s`;
}

const Count = ({ value }: { value: number | null }) => (
  <span className="block text-right tabular-nums">
    {value === null ? (
      <>
        <span aria-hidden="true">—</span>
        <span className="sr-only">not counted</span>
      </>
    ) : (
      value
    )}
  </span>
);

const Instant = ({ iso }: { iso: string | null }) =>
  iso === null ? <>—</> : <time dateTime={iso}>{formatDateTime(iso)}</time>;

/** Failed runs say so in words and with a shape, never by colour alone; the error is shown beside it. */
function RunResult({ run }: { run: JobRun }) {
  if (run.error !== null) {
    return (
      <span className="flex flex-col">
        <span className="font-medium text-red-800">
          <span aria-hidden="true">✕ </span>Failed
        </span>
        <span className="text-sm text-ink-700 break-words">{run.error}</span>
      </span>
    );
  }
  if (run.finishedAt === null) return <span>Running</span>;
  return (
    <span>
      <span aria-hidden="true">✓ </span>Finished
    </span>
  );
}

const column = dataTableColumns<JobRun>();

// Module scope: the table needs stable columns.
const columns = column.columns([
  column.accessor("job", {
    header: "Job",
    sortFn: "text",
    cell: (info) => <span className="font-medium">{jobNames[info.getValue()] ?? info.getValue()}</span>,
  }),
  column.accessor((run) => (run.startedBy ? `Manual, ${run.startedBy.name}` : "Scheduled"), {
    id: "trigger",
    header: "Started by",
    sortFn: "text",
  }),
  column.accessor("asOf", {
    header: "As of",
    sortFn: "text",
    cell: (info) => <Instant iso={info.getValue()} />,
  }),
  column.accessor("startedAt", {
    header: "Started",
    sortFn: "text",
    cell: (info) => <Instant iso={info.getValue()} />,
  }),
  column.accessor("finishedAt", {
    header: "Finished",
    sortFn: "text",
    cell: (info) => <Instant iso={info.getValue()} />,
  }),
  column.accessor((run) => (run.error === null ? (run.finishedAt === null ? "running" : "ok") : "failed"), {
    id: "result",
    header: "Result",
    sortFn: "text",
    cell: (info) => <RunResult run={info.row.original} />,
  }),
  column.accessor("attempt", {
    header: "Attempt",
    sortFn: "basic",
    cell: (info) => (
      <span className="block text-right tabular-nums">
        {info.getValue()}
        {info.getValue() > 1 ? <span className="sr-only"> (a retry)</span> : null}
      </span>
    ),
  }),
  column.accessor((run) => durationMs(run), {
    id: "duration",
    header: "Duration",
    sortFn: "basic",
    cell: (info) => <span className="tabular-nums">{formatDuration(info.getValue())}</span>,
  }),
  column.accessor((run) => countOf(run, "lapsed"), {
    id: "lapsed",
    header: "Lapsed",
    sortFn: "basic",
    cell: (info) => <Count value={info.getValue()} />,
  }),
  column.accessor((run) => countOf(run, "noticesCreated"), {
    id: "notices",
    header: "Notices",
    sortFn: "basic",
    cell: (info) => <Count value={info.getValue()} />,
  }),
  column.accessor((run) => countOf(run, "emailsQueued", "sent"), {
    id: "emails",
    header: "E-mails",
    sortFn: "basic",
    cell: (info) => <Count value={info.getValue()} />,
  }),
  column.accessor((run) => countOf(run, "changedStandings"), {
    id: "standings",
    header: "Standings changed",
    sortFn: "basic",
    cell: (info) => <Count value={info.getValue()} />,
  }),
]);

/** The scheduled jobs' recent runs, newest first (the server keeps the last 50). */
export function JobRunsTable({ runs }: { runs: JobRun[] }) {
  return (
    <DataTable
      caption="Recent job runs"
      hideCaption
      columns={columns}
      data={runs}
      getRowId={(run) => String(run.id)}
      // ISO 8601 instants sort correctly as text.
      initialSorting={[{ id: "startedAt", desc: true }]}
      empty={
        <EmptyState title="No job runs yet">
          The daily lapse check records each run here, whether it runs on the schedule or from the command
          line. A failed run is recorded too, and retried a few minutes later.
        </EmptyState>
      }
    />
  );
}
