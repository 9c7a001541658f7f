import { useMemo, useState } from "react";
import { useSuspenseQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { hrefs } from "@/config/paths.ts";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { CautionNote } from "@/components/ui/caution-note.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import type { Credential } from "@/features/credentials/api/credential-shapes.ts";
import { credentialsQuery } from "@/features/credentials/api/get-credentials.ts";
import { LapseTimelineChart } from "@/features/credentials/components/lapse-timeline-chart.tsx";
import { byWeek, lapsingWithin } from "@/features/credentials/components/lapse-window.ts";
import { CalendarFeedPanel } from "@/features/calendar/components/calendar-feed-panel.tsx";
import { LapsingTable } from "@/features/credentials/components/lapsing-table.tsx";
import { openReturns } from "@/features/credentials/components/open-returns.ts";
import { openLapses } from "@/features/credentials/components/open-lapses.ts";
import { LapsedList } from "@/features/credentials/components/lapsed-list.tsx";
import { ReturnedList } from "@/features/credentials/components/returned-list.tsx";
import { queryClient } from "@/lib/query-client.ts";

// The horizon of "what lapses next": the first warning goes out 60 days ahead, so 90 shows what comes after it too.
const HORIZON_DAYS = 90;
const HORIZON_WEEKS = Math.ceil(HORIZON_DAYS / 7);

export async function loader() {
  await queryClient.ensureQueryData(credentialsQuery());
  return null;
}

const renewHref = (c: Credential) =>
  hrefs.documentNew({ typeCode: c.typeCode, technicianId: c.technicianId });

export function Component() {
  const { data: credentials } = useSuspenseQuery(credentialsQuery());
  const [now] = useState(() => new Date());
  const lapsing = useMemo(() => lapsingWithin(credentials, now, HORIZON_DAYS), [credentials, now]);
  const weeks = useMemo(() => byWeek(lapsing, now, HORIZON_WEEKS), [lapsing, now]);
  const returned = useMemo(() => openReturns(credentials), [credentials]);
  const lapsed = useMemo(() => openLapses(credentials), [credentials]);
  const showsInsurance = credentials.some((c) => c.category === "insurance");

  return (
    <>
      <PageHeader
        title="Dashboard"
        description="What has lapsed, what lapses next and what was returned to you, soonest first."
        actions={
          <Link to={hrefs.documentNew()} className={buttonStyles("primary")}>
            Upload a document
          </Link>
        }
      />
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
      {showsInsurance && <CautionNote className="mt-8" />}
    </>
  );
}
