import { useMemo } from "react";
import { useSearchParams } from "react-router-dom";
import type { GateCheckLogQuery, GateCheckRecord } from "@shared/gate/check-log.ts";
import { formatLocalDateTime } from "@shared/dates/local-time.ts";
import { readerTimeZone } from "@shared/standing/lapse-words.ts";
import { DataTable, dataTableColumns } from "@/components/ui/data-table.tsx";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { StatusBadge } from "@/components/ui/status-badge.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { useGateChecks } from "../api/get-gate-checks.ts";

const column = dataTableColumns<GateCheckRecord & { when: string }>();

function columnsFor(side: "service" | "shop") {
  return [
    column.accessor("checkedAt", {
      header: "When",
      sortFn: "text",
      cell: (c) => c.row.original.when,
    }),
    column.accessor("technicianName", { header: "Technician" }),
    ...(side === "shop" ? [column.accessor("companyName", { header: "Company" })] : []),
    column.accessor((r) => r.siteName ?? "No gate sign", { id: "site", header: "Site" }),
    ...(side === "service" ? [column.accessor((r) => r.shopName ?? "", { id: "shop", header: "Shop" })] : []),
    column.accessor("state", {
      header: "At the gate",
      cell: (c) => <StatusBadge status={c.getValue()} />,
    }),
  ];
}

type FilterKey = "from" | "to" | "siteId" | "technicianId";

/**
 * Every badge scan the reader's company may see, newest first: the service office's technicians wherever they were
 * checked, or the shop's own sites. Days in the filters and times in the rows are the reader's own zone.
 */
export function GateCheckLog({ side }: { side: "service" | "shop" }) {
  const [search, setSearch] = useSearchParams();
  const timeZone = readerTimeZone();
  const filters: GateCheckLogQuery = {
    timeZone,
    from: search.get("from") || undefined,
    to: search.get("to") || undefined,
    siteId: Number(search.get("siteId")) || undefined,
    technicianId: Number(search.get("technicianId")) || undefined,
  };
  const log = useGateChecks(filters);
  const columns = useMemo(() => columnsFor(side), [side]);
  const rows = useMemo(
    () => (log.data?.checks ?? []).map((c) => ({ ...c, when: formatLocalDateTime(c.checkedAt, timeZone) })),
    [log.data, timeZone],
  );
  const choose = (key: FilterKey, value: string) =>
    setSearch(
      (previous) => {
        const next = new URLSearchParams(previous);
        if (value) next.set(key, value);
        else next.delete(key);
        return next;
      },
      { replace: true },
    );

  return (
    <div className="space-y-4">
      <form
        role="search"
        aria-label="Filter gate checks"
        onSubmit={(e) => e.preventDefault()}
        className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4"
      >
        <TextField
          label="From"
          name="from"
          type="date"
          value={search.get("from") ?? ""}
          onChange={(e) => choose("from", e.currentTarget.value)}
        />
        <TextField
          label="To"
          name="to"
          type="date"
          value={search.get("to") ?? ""}
          onChange={(e) => choose("to", e.currentTarget.value)}
        />
        <SelectField
          label="Site"
          name="siteId"
          placeholder="Every site"
          value={search.get("siteId") ?? ""}
          options={(log.data?.sites ?? []).map((s) => ({ value: String(s.id), label: s.name }))}
          onChange={(e) => choose("siteId", e.currentTarget.value)}
        />
        <SelectField
          label="Technician"
          name="technicianId"
          placeholder="Every technician"
          value={search.get("technicianId") ?? ""}
          options={(log.data?.technicians ?? []).map((t) => ({ value: String(t.id), label: t.name }))}
          onChange={(e) => choose("technicianId", e.currentTarget.value)}
        />
      </form>
      <p className="text-sm text-ink-700">Times are shown in your zone ({timeZone}).</p>
      <FormError error={log.error} labels={{ from: "From", to: "To", timeZone: "Time zone" }} />
      {log.isPending && <p role="status">Loading gate checks…</p>}
      {log.data && (
        <DataTable
          caption="Gate checks, newest first"
          columns={columns}
          data={rows}
          getRowId={(r) => String(r.id)}
          empty={
            <EmptyState title="No gate checks">
              {side === "shop"
                ? "Checks appear here when the front desk scans a badge at one of your sites."
                : "Checks appear here when a shop's front desk scans one of your technicians' badges."}
            </EmptyState>
          }
        />
      )}
      {log.data?.truncated && (
        <p className="text-sm text-ink-700">
          Only the newest checks are shown; narrow the dates to see older ones.
        </p>
      )}
    </div>
  );
}
