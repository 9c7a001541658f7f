import { EmptyState } from "@/components/ui/empty-state.tsx";
import { StatusBadge } from "@/components/ui/status-badge.tsx";
import { credentialTypeByCode } from "@shared/credentials/catalogue.ts";
import { lapseWords, readerTimeZone } from "@shared/standing/lapse-words.ts";
import { onlyCompanyCanRenew } from "@shared/standing/who-renews.ts";
import { formatInstantDate } from "@/lib/format-date.ts";
import { daysUntil } from "@shared/standing/warning-windows.ts";
import type {
  RequirementResultView,
  StandingAgainstView,
  TechnicianStanding,
} from "../api/get-technician-standing.ts";

const reasonWords: Record<NonNullable<RequirementResultView["reason"]>, string> = {
  missing: "Missing",
  awaiting_verification: "Awaiting verification",
  returned: "Returned",
  lapsed: "Lapsed",
  not_yet_in_force: "Not yet in force",
  below_limit: "Below the limit",
  flag_absent: "Mark missing",
  wrong_control_family: "Wrong control family",
  below_level: "Level too low",
  too_old: "Too old",
  underlying_missing: "No underlying policy",
  exemption_does_not_cover: "Exemption does not cover",
};

function OverallBadge({ result, now }: { result: StandingAgainstView; now: Date }) {
  if (result.standing === "lapsing" && result.earliestLapse)
    return <StatusBadge status="lapsing" daysLeft={daysUntil(new Date(result.earliestLapse), now)} />;
  return <StatusBadge status={result.standing === "lapsing" ? "cleared" : result.standing} />;
}

/** Who is looking: a technician cannot renew what the company holds, so the line says who acts. */
export type StandingViewer = "technician" | "office";

/** The catalogue types a line accepts (the engine sends the whole requirement; older rows may lack them). */
function typesOf(result: RequirementResultView) {
  const codes = (result.requirement as { typeCodes?: unknown }).typeCodes;
  return Array.isArray(codes)
    ? codes.flatMap((code) => {
        const type = typeof code === "string" ? credentialTypeByCode.get(code) : undefined;
        return type ? [type] : [];
      })
    : [];
}

function RequirementRow({
  result,
  now,
  viewer,
}: {
  result: RequirementResultView;
  now: Date;
  viewer: StandingViewer;
}) {
  const whoActs =
    viewer === "technician" &&
    result.status !== "met" &&
    onlyCompanyCanRenew((result.requirement as { typeCodes?: unknown[] }).typeCodes) ? (
      <span className="mt-1 block font-medium text-ink-900">
        Only your office can renew this: it is the company&apos;s document, so ask them to upload the renewed
        one.
      </span>
    ) : null;
  const fieldSet = typesOf(result)[0]?.fieldSet;
  const badge =
    result.status === "met" ? (
      <StatusBadge status="cleared" />
    ) : result.status === "lapsing" && result.lapsesAt ? (
      <StatusBadge status="lapsing" daysLeft={daysUntil(new Date(result.lapsesAt), now)} />
    ) : (
      <StatusBadge status="not_cleared" />
    );
  return (
    <li className="grid gap-1 py-3 sm:grid-cols-[minmax(0,16rem)_auto_1fr] sm:items-start sm:gap-4">
      <span className="font-medium text-ink-900">{result.requirement.label}</span>
      <span>{badge}</span>
      <span className="text-sm text-ink-800">
        {result.status === "unmet" ? (
          <>
            {result.reason && <span className="font-semibold">{reasonWords[result.reason]}: </span>}
            {result.detail}
            {whoActs}
          </>
        ) : result.lapsesAt ? (
          // The engine's sentence names credential ids and ISO dates; people get the date in words.
          <span className="text-ink-700">
            {result.metBy && <span className="text-ink-900">Met by {result.metBy}. </span>}
            Counts: {lapseWords(result.lapsesAt, fieldSet, readerTimeZone())}
            {whoActs}
          </span>
        ) : (
          <span className="text-ink-700">
            {result.metBy ? `Met by ${result.metBy}; it does not expire` : "Met; it does not expire"}
          </span>
        )}
      </span>
    </li>
  );
}

function StandingBlock({
  title,
  result,
  now,
  viewer,
}: {
  title: string;
  result: StandingAgainstView;
  now: Date;
  viewer: StandingViewer;
}) {
  return (
    <section aria-label={title} className="rounded-lg border border-ink-100 bg-white px-4 py-3">
      <div className="flex flex-wrap items-center gap-3 border-b border-ink-100 pb-2">
        <h3 className="font-semibold text-ink-900">{title}</h3>
        <OverallBadge result={result} now={now} />
        {result.earliestLapse && (
          <span className="text-sm text-ink-700">
            Earliest lapse {formatInstantDate(result.earliestLapse)}
          </span>
        )}
      </div>
      <ul className="divide-y divide-ink-100">
        {result.results.map((r, i) => (
          <RequirementRow
            key={r.requirement.id ?? `${r.requirement.label}-${i}`}
            result={r}
            now={now}
            viewer={viewer}
          />
        ))}
      </ul>
    </section>
  );
}

/** Each requirement, whether it is met, and why not; the baseline first, then any site's requirement sets. */
export function StandingPanel({
  standing,
  now,
  viewer = "office",
}: {
  standing: TechnicianStanding | null;
  now: Date;
  viewer?: StandingViewer;
}) {
  if (!standing || (!standing.baseline && standing.requirementSets.length === 0)) {
    return (
      <EmptyState title="Standing is not available yet">
        The standing of each requirement will show here once it has been computed.
      </EmptyState>
    );
  }
  return (
    <div className="space-y-4">
      {standing.baseline && (
        <StandingBlock title="Platform baseline" result={standing.baseline} now={now} viewer={viewer} />
      )}
      {standing.requirementSets.map((set) => (
        <StandingBlock key={set.requirementSetId} title={set.name} result={set} now={now} viewer={viewer} />
      ))}
    </div>
  );
}
