import { Link } from "react-router-dom";
import {
  historySourceLabels,
  problemAreaLabels,
  type HistoryEntryDto as HistoryEntry,
  type MachineHistoryDto as MachineHistory,
} from "@shared/machines/service-history.ts";
import { requestKindLabels } from "@shared/service-requests/schemas.ts";
import { hrefs } from "@/config/paths.ts";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { StatusBadge } from "@/components/ui/status-badge.tsx";
import { formatIsoDate } from "@/lib/format-date.ts";
import { machineHistoryCsvUrl, machineHistoryPrintUrl } from "../api/machine-keys.ts";

const hoursWords = (e: HistoryEntry) =>
  e.hoursOnSite === null && e.travelHours === null
    ? null
    : `${e.hoursOnSite ?? 0} h on site, ${e.travelHours ?? 0} h travel`;

const sizeWords = (bytes: number) =>
  bytes >= 1_048_576 ? `${(bytes / 1_048_576).toFixed(1)} MB` : `${Math.max(1, Math.round(bytes / 1024))} KB`;

function Entry({ entry, earlier }: { entry: HistoryEntry; earlier: HistoryEntry | undefined }) {
  const who = [entry.serviceCompanyName, entry.technicianName].filter(Boolean).join(", ");
  const facts: [string, string][] = [];
  if (who) facts.push(["Service", who]);
  const hours = hoursWords(entry);
  if (hours) facts.push(["Hours", hours]);
  if (entry.problem) facts.push(["Problem reported", entry.problem]);
  if (entry.partsUsed.length)
    facts.push([
      "Parts used",
      entry.partsUsed
        .map((p) => `${p.quantity} × ${p.description}${p.partNumber ? ` (${p.partNumber})` : ""}`)
        .join("; "),
    ]);
  return (
    <li className="rounded-lg border border-ink-100 bg-white p-4" data-entry={entry.key}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="font-semibold text-ink-900">
          {formatIsoDate(entry.date)} · {entry.kind ? requestKindLabels[entry.kind] : "Kind not stated"}
          {entry.problemArea && ` · ${problemAreaLabels[entry.problemArea]}`}
        </h3>
        <span
          className={`rounded-full border px-2 py-0.5 text-xs font-medium ${
            entry.source === "shop_record"
              ? "border-dashed border-ink-300 text-ink-700"
              : "border-ink-300 text-ink-900"
          }`}
        >
          {historySourceLabels[entry.source]}
        </span>
      </div>
      {earlier && (
        <p className="mt-2 rounded-md border-l-4 border-accent-700 bg-ink-50 px-2 py-1 text-sm text-ink-900">
          <strong>Repeat fault:</strong> the same problem area was repaired on {formatIsoDate(earlier.date)},
          within 90 days.
        </p>
      )}
      {entry.note && (
        <p className="mt-2 whitespace-pre-line break-words text-sm text-ink-900">{entry.note}</p>
      )}
      {facts.length > 0 && (
        <dl className="mt-2 grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[max-content_1fr]">
          {facts.map(([term, value]) => (
            <div key={term} className="contents">
              <dt className="font-medium text-ink-700">{term}</dt>
              <dd className="break-words text-ink-900">{value}</dd>
            </div>
          ))}
        </dl>
      )}
      {entry.attachments.length > 0 && (
        <ul className="mt-2 space-y-1 text-sm" aria-label="Attachments">
          {entry.attachments.map((a) => (
            <li key={a.documentId}>
              <a href={a.url} className="break-all text-ink-900 underline underline-offset-2">
                {a.name}
              </a>{" "}
              <span className="text-ink-700">({sizeWords(a.sizeBytes)})</span>
            </li>
          ))}
        </ul>
      )}
      <div className="mt-2 flex flex-wrap items-center gap-3 text-sm">
        {entry.standingSnapshot && (
          <span className="inline-flex flex-wrap items-center gap-2 text-ink-700">
            Standing when completed: <StatusBadge status={entry.standingSnapshot.standing} />
          </span>
        )}
        {entry.workOrderId !== null && (
          <Link
            to={hrefs.workOrder(entry.workOrderId)}
            className="inline-flex min-h-11 items-center text-ink-900 underline underline-offset-2 md:min-h-0"
          >
            Work order #{entry.workOrderId}
          </Link>
        )}
      </div>
    </li>
  );
}

/** Every confirmed work order on the machine and the shop's own records, newest first. */
export function ServiceHistory({
  history,
  exports = true,
}: {
  history: MachineHistory;
  /** The CSV and printable page are the current owner's; a seller's read-only copy shows the entries only. */
  exports?: boolean;
}) {
  const byKey = new Map(history.entries.map((e) => [e.key, e]));
  return (
    <section aria-labelledby="service-history" className="space-y-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="service-history" className="text-lg font-semibold text-ink-900">
          Service history
        </h2>
        {exports && (
          <div className="flex flex-wrap gap-2">
            <a href={machineHistoryCsvUrl(history.machineId)} className={buttonStyles("secondary")} download>
              Download CSV
            </a>
            <a
              href={machineHistoryPrintUrl(history.machineId)}
              target="_blank"
              rel="noopener"
              className={buttonStyles("secondary")}
            >
              Printable page
            </a>
          </div>
        )}
      </div>
      <p className="text-sm text-ink-700">
        Entries recorded by the shop are its own notes of outside work: they never count toward a technician's
        rating. A repeat fault is a repair in the same problem area within 90 days of the one before.
      </p>
      {history.entries.length === 0 ? (
        <EmptyState title="No service on record yet">
          Confirmed work orders on this machine appear here; so does work you record yourself.
        </EmptyState>
      ) : (
        <ol className="space-y-3">
          {history.entries.map((e) => (
            <Entry key={e.key} entry={e} earlier={e.repeatOf ? byKey.get(e.repeatOf) : undefined} />
          ))}
        </ol>
      )}
    </section>
  );
}
