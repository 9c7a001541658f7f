import { useSuspenseQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { paths } from "@/config/paths.ts";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { StatusKey } from "@/components/ui/status-key.tsx";
import { CalendarFeedPanel } from "@/features/calendar/components/calendar-feed-panel.tsx";
import { rosterQuery } from "@/features/roster/api/get-roster.ts";
import { useRemoveFromRoster } from "@/features/roster/api/remove-from-roster.ts";
import { rosterExportUrl } from "@/features/roster/api/roster-keys.ts";
import { RosterTable, rosterRowsOf } from "@/features/roster/components/roster-table.tsx";
import { queryClient } from "@/lib/query-client.ts";

export async function loader() {
  await queryClient.ensureQueryData(rosterQuery());
  return null;
}

export function Component() {
  const { data: entries } = useSuspenseQuery(rosterQuery());
  const remove = useRemoveFromRoster();
  const rows = rosterRowsOf(entries);
  return (
    <>
      <PageHeader
        title="Roster"
        description="Your approved vendors and their technicians, with each one's standing and next lapse. You get an alert when one stops being cleared or lapses within 30 days."
        actions={
          entries.length > 0 && (
            <a href={rosterExportUrl} download className={buttonStyles("secondary")}>
              Export CSV
            </a>
          )
        }
      />
      <FormError error={remove.error} />
      {rows.length === 0 ? (
        <EmptyState
          title="Nobody on your roster yet"
          action={
            <Link to={paths.buyer.directory} className={buttonStyles("primary")}>
              Search the directory
            </Link>
          }
        >
          Open a technician in the directory and choose “Add to roster”.
        </EmptyState>
      ) : (
        <RosterTable
          rows={rows}
          removingEntryId={remove.isPending ? (remove.variables ?? null) : null}
          onRemove={remove.mutate}
        />
      )}
      {rows.length > 0 && <StatusKey statuses={["cleared", "lapsing", "not_cleared", "not_checked"]} />}
      <div className="mt-8 max-w-2xl">
        <CalendarFeedPanel description="When your roster's technicians and vendors have credentials lapsing, as dates in your own calendar program." />
      </div>
    </>
  );
}
