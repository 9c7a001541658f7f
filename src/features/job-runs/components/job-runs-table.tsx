import { DataTable, dataTableColumns } from "@/components/ui/data-table.tsx";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { formatDateTime } from "@/lib/format-date-time.ts";
import type { JobRun } from "../api/get-job-runs.ts";

const jobNames: Record<string, string> = {
  lapse: "Daily lapse check",
  reviewer_digest: "Reviewer digest",
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
  run.finishedAt === null ? null : new Date(run.finishedAt).getTime() - new Date(run.startedAt).getTime();

function formatDuration(ms: number | null): string {
  if (ms === null) return "Not finished";
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

const column = dataTableColumns<JobRun>();

// Module scope: the table needs stable columns.
const columns = column.columns([
  column.accessor("job", {
    header: "Job",
    sortFn: "text",
    cell: (info) => <span className="font-medium">{jobNames[info.getValue()] ?? info.getValue()}</span>,
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
          line.
        </EmptyState>
      }
    />
  );
}
