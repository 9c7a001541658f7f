import type { ComparisonRowDto } from "@shared/service-requests/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { DataTable, dataTableColumns } from "@/components/ui/data-table.tsx";
import { StatusBadge } from "@/components/ui/status-badge.tsx";
import { formatCents } from "@/lib/format-money.ts";
import { formatDateTime } from "@/lib/format-date-time.ts";

const column = dataTableColumns<ComparisonRowDto>();

export const responseWords = (minutes: number | null) =>
  minutes === null ? "No answers yet" : minutes < 90 ? `${minutes} min` : `${(minutes / 60).toFixed(1)} h`;

const standingBadge = (row: ComparisonRowDto) =>
  row.standing === "lapsing" ? (
    // Still cleared today; the requirement list says which credential lapses and when.
    <span className="inline-flex rounded-full border border-amber-700/40 bg-amber-50 px-2 py-0.5 text-sm font-medium">
      ◔ Cleared, lapsing soon
    </span>
  ) : (
    <StatusBadge status={row.standing} />
  );

function TotalParts({ row }: { row: ComparisonRowDto }) {
  const t = row.total;
  return (
    <div>
      <div className="font-semibold">{formatCents(t.totalCents)}</div>
      <div className="text-xs text-ink-600">
        travel {formatCents(t.travelCents)} · labor {formatCents(t.labourCents)} · mileage{" "}
        {formatCents(t.mileageCents)} · parts {formatCents(t.partsCents)}
        {t.unpricedParts > 0 && ` (+${t.unpricedParts} unpriced)`} · before tax
      </div>
    </div>
  );
}

function Requirements({ row }: { row: ComparisonRowDto }) {
  return (
    <details className="text-sm">
      <summary className="cursor-pointer">{standingBadge(row)}</summary>
      <ul className="mt-1 list-disc pl-5 text-xs">
        {row.requirements.map((r, i) => (
          <li key={i}>
            {r.label}: {r.status === "met" ? "met" : "not met"}, {r.detail}
          </li>
        ))}
      </ul>
    </details>
  );
}

type Props = {
  rows: ComparisonRowDto[];
  canAccept: boolean;
  pending: boolean;
  onAccept: (estimateId: number) => void;
};

/** Sortable on wide screens; one card per estimate on a phone. */
// The ranked score with no confirmed work behind it is only the prior: say so instead of showing a number.
const ratingWords = (rating: { score: number; count: number }) =>
  rating.count === 0
    ? "No ratings yet"
    : `${rating.score.toFixed(2)} (${rating.count} ${rating.count === 1 ? "rating" : "ratings"})`;

export function ComparisonTable({ rows, canAccept, pending, onAccept }: Props) {
  const columns = [
    column.accessor("companyName", {
      header: "Company and technician",
      cell: (c) => (
        <div>
          <div className="font-medium">{c.getValue()}</div>
          <div className="text-sm text-ink-700">{c.row.original.technicianName}</div>
        </div>
      ),
    }),
    column.accessor("standing", { header: "Standing", cell: (c) => <Requirements row={c.row.original} /> }),
    column.accessor("distanceMiles", {
      header: "Distance",
      cell: (c) => `${c.getValue()} mi · ${c.row.original.driveHours} h drive`,
    }),
    column.accessor("earliestArrival", {
      header: "Earliest arrival",
      cell: (c) => formatDateTime(c.getValue()),
    }),
    column.accessor((r) => r.total.totalCents, {
      id: "total",
      header: "Total",
      cell: (c) => <TotalParts row={c.row.original} />,
    }),
    column.accessor((r) => r.rating.score, {
      id: "rating",
      header: "Rating",
      cell: (c) => ratingWords(c.row.original.rating),
    }),
    column.accessor((r) => r.medianResponseMinutes ?? Number.MAX_SAFE_INTEGER, {
      id: "response",
      header: "Typical response",
      cell: (c) => responseWords(c.row.original.medianResponseMinutes),
    }),
    column.accessor("acceptedEstimates", { header: "Accepted before" }),
    column.display({
      id: "accept",
      header: "Decide",
      cell: (c) =>
        canAccept ? (
          <Button
            pending={pending}
            aria-label={`Accept ${c.row.original.companyName}`}
            onClick={() => onAccept(c.row.original.estimateId)}
          >
            Accept
          </Button>
        ) : null,
    }),
  ];
  return (
    <>
      <div className="hidden md:block">
        <DataTable
          columns={columns}
          data={rows}
          caption="Estimates received"
          initialSorting={[{ id: "total", desc: false }]}
          getRowId={(r) => String(r.estimateId)}
          empty={<p>No estimates yet.</p>}
        />
      </div>
      <ul className="space-y-3 md:hidden" aria-label="Estimates received">
        {rows.length === 0 && <li>No estimates yet.</li>}
        {rows.map((row) => (
          <li key={row.estimateId} className="space-y-2 rounded-md border border-ink-200 bg-white p-3">
            <div className="font-medium">
              {row.companyName} · {row.technicianName}
            </div>
            <Requirements row={row} />
            <TotalParts row={row} />
            <div className="text-sm">
              {row.distanceMiles} mi · arrives {formatDateTime(row.earliestArrival)} · responds in{" "}
              {responseWords(row.medianResponseMinutes)} · {ratingWords(row.rating)}
            </div>
            {canAccept && (
              <Button pending={pending} onClick={() => onAccept(row.estimateId)}>
                Accept {row.companyName}
              </Button>
            )}
          </li>
        ))}
      </ul>
    </>
  );
}
