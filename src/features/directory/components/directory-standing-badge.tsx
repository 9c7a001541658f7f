import { StatusBadge } from "@/components/ui/status-badge.tsx";
import { daysUntil } from "@/lib/format-date.ts";

type DirectoryStandingBadgeProps = {
  standing: "cleared" | "lapsing" | "not_cleared";
  earliestLapse: string | null;
  now?: Date;
};

/** Shape and word: "Cleared", "Lapsing in N days" or "Not cleared". */
export function DirectoryStandingBadge({
  standing,
  earliestLapse,
  now = new Date(),
}: DirectoryStandingBadgeProps) {
  if (standing === "lapsing" && earliestLapse)
    return <StatusBadge status="lapsing" daysLeft={daysUntil(earliestLapse, now)} />;
  return <StatusBadge status={standing === "lapsing" ? "cleared" : standing} />;
}
