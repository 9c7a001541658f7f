import type { ProfileStandingDto as ProfileStanding } from "@shared/directory/directory-shapes.ts";
import { DirectoryStandingBadge } from "./directory-standing-badge.tsx";

/** The technician against each of the buyer's requirement sets, with the reason for every unmet requirement. */
export function ProfileStandings({ standings }: { standings: readonly ProfileStanding[] }) {
  if (standings.length === 0)
    return (
      <p className="text-sm text-ink-700">
        You have no requirement sets yet; only the platform baseline applies.
      </p>
    );
  return (
    <ul className="space-y-3">
      {standings.map((s) => (
        <li key={s.requirementSetId} className="rounded-lg border border-ink-100 bg-white p-4">
          <p className="flex flex-wrap items-center gap-2 font-semibold text-ink-900">
            {s.name}
            <DirectoryStandingBadge standing={s.standing} earliestLapse={s.earliestLapse} />
          </p>
          {s.results.some((r) => r.status !== "unmet" && r.metBy) && (
            <ul aria-label={`How ${s.name} is met`} className="mt-2 space-y-0.5 text-sm text-ink-800">
              {s.results
                .filter((r) => r.status !== "unmet" && r.metBy)
                .map((r, i) => (
                  <li key={i}>
                    <span className="font-medium text-ink-900">{r.requirement.label}</span>: met by {r.metBy}
                  </li>
                ))}
            </ul>
          )}
          {s.unmet.length > 0 && (
            <ul className="mt-2 list-disc space-y-0.5 pl-5 text-sm text-ink-900">
              {s.unmet.map((u, i) => (
                <li key={i}>
                  <span className="font-medium">{u.label}</span>: {u.detail}
                </li>
              ))}
            </ul>
          )}
        </li>
      ))}
    </ul>
  );
}
