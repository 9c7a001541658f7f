import { useMemo, useState } from "react";
import { useSuspenseQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { hrefs } from "@/config/paths.ts";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { PageHeader } from "@/components/ui/page-header.tsx";
import type { CredentialDto as Credential } from "@shared/credentials/credential-shapes.ts";
import { credentialsQuery } from "@/features/credentials/api/get-credentials.ts";
import { LapseTimelineChart } from "@/features/credentials/components/lapse-timeline-chart.tsx";
import { byWeek } from "@/features/credentials/components/lapse-window.ts";
import { lapsingSoon } from "@shared/standing/lapsing-soon.ts";
import { OFFICE_LOOK_AHEAD_DAYS } from "@shared/standing/warning-windows.ts";
import { CalendarFeedPanel } from "@/features/calendar/components/calendar-feed-panel.tsx";
import { LapsingTable } from "@/features/credentials/components/lapsing-table.tsx";
import { LapsedList } from "@/features/credentials/components/lapsed-list.tsx";
import { ReturnedList } from "@/features/credentials/components/returned-list.tsx";
import { workOrdersQuery } from "@/features/work-orders/api/get-work-orders.ts";
import { WorkOrdersToAnswer } from "@/features/work-orders/components/work-orders-to-answer.tsx";
import { queryClient } from "@/lib/query-client.ts";

const HORIZON_DAYS = OFFICE_LOOK_AHEAD_DAYS;
const HORIZON_WEEKS = Math.ceil(HORIZON_DAYS / 7);

export async function loader() {
  await Promise.all([
    queryClient.ensureQueryData(credentialsQuery()),
    queryClient.ensureQueryData(workOrdersQuery("requested")),
  ]);
  return null;
}

const renewHref = (c: Credential) =>
  hrefs.documentNew({ typeCode: c.typeCode, technicianId: c.technicianId });

export function Component() {
  const { data: credentials } = useSuspenseQuery(credentialsQuery());
  const { data: toAnswer } = useSuspenseQuery(workOrdersQuery("requested"));
  const [now] = useState(() => new Date());
  const lapsing = useMemo(() => lapsingSoon(credentials, now, HORIZON_DAYS), [credentials, now]);
  const weeks = useMemo(() => byWeek(lapsing, now, HORIZON_WEEKS), [lapsing, now]);
  // The server says which returned and lapsed credentials still wait for a new upload.
  const returned = useMemo(
    () => credentials.filter((c) => c.state === "returned" && c.awaitsHolder),
    [credentials],
  );
  const lapsed = useMemo(
    () => credentials.filter((c) => c.state === "lapsed" && c.awaitsHolder),
    [credentials],
  );

  return (
    <>
      <PageHeader
        title="Dashboard"
        description="What waits for the office: work orders to answer, what has lapsed, what lapses next and what was returned to you."
        actions={
          <Link to={hrefs.documentNew()} className={buttonStyles("primary")}>
            Upload a document
          </Link>
        }
      />
      <section aria-labelledby="to-answer-heading" className="mb-8 space-y-3">
        <h2 id="to-answer-heading" className="text-lg font-semibold text-ink-900">
          Work orders to answer{" "}
          <span className="text-base font-normal text-ink-700">({toAnswer.length})</span>
        </h2>
        <WorkOrdersToAnswer workOrders={toAnswer} />
      </section>
      <div className="grid grid-cols-1 items-start gap-8 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <section aria-labelledby="lapsing-heading" className="space-y-4">
          <h2 id="lapsing-heading" className="text-lg font-semibold text-ink-900">
            What lapses next{" "}
            <span className="text-base font-normal text-ink-700">(next {HORIZON_DAYS} days)</span>
          </h2>
          <LapseTimelineChart weeks={weeks} />
          <LapsingTable credentials={lapsing} now={now} renewHref={renewHref} />
        </section>
        <div className="space-y-8">
          <section aria-labelledby="lapsed-heading" className="space-y-3">
            <h2 id="lapsed-heading" className="text-lg font-semibold text-ink-900">
              Lapsed <span className="text-base font-normal text-ink-700">({lapsed.length})</span>
            </h2>
            <LapsedList credentials={lapsed} renewHref={renewHref} />
          </section>
          <section aria-labelledby="returned-heading" className="space-y-3">
            <h2 id="returned-heading" className="text-lg font-semibold text-ink-900">
              Returned to you <span className="text-base font-normal text-ink-700">({returned.length})</span>
            </h2>
            <ReturnedList credentials={returned} correctionHref={renewHref} />
          </section>
          <CalendarFeedPanel description="Your company's lapse dates and warning dates in your own calendar program, updated on its own." />
        </div>
      </div>
    </>
  );
}
