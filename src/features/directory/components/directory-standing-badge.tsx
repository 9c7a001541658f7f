import { StatusBadge } from "@/components/ui/status-badge.tsx";
import { daysUntil } from "@shared/standing/warning-windows.ts";
import type { JudgedAgainstDto as JudgedAgainst } from "@shared/directory/directory-shapes.ts";

type DirectoryStandingBadgeProps = {
  standing: "cleared" | "lapsing" | "not_cleared";
  earliestLapse: string | null;
  /** Without a shop requirement set the baseline covers only the company's insurance; the badge says so. */
  judgedAgainst?: JudgedAgainst | undefined;
  now?: Date;
};

/** The word a baseline-only pass earns: it vouches for the company's cover, nothing the technician carries. */
export const BASELINE_ONLY_WORD = "Company insurance in force";

/** Shape and word: "Cleared", "Lapsing in N days" or "Not cleared", and which rules they were judged by. */
export function DirectoryStandingBadge({
  standing,
  earliestLapse,
  judgedAgainst,
  now = new Date(),
}: DirectoryStandingBadgeProps) {
  const baselineOnly = judgedAgainst?.kind === "baseline";
  const badge =
    standing === "lapsing" && earliestLapse ? (
      <StatusBadge status="lapsing" daysLeft={daysUntil(new Date(earliestLapse), now)} />
    ) : standing === "not_cleared" ? (
      <StatusBadge status="not_cleared" />
    ) : (
      <StatusBadge status="cleared" word={baselineOnly ? BASELINE_ONLY_WORD : undefined} />
    );
  if (!judgedAgainst) return badge;
  return (
    <span className="inline-flex flex-col items-start gap-0.5">
      {badge}
      <span className="text-xs text-ink-700" data-testid="judged-against">
        {judgedAgainst.kind === "baseline"
          ? "Baseline only: no shop requirement set"
          : `Against ${judgedAgainst.name}`}
      </span>
    </span>
  );
}
