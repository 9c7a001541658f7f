import type { ReactNode } from "react";

/** Standing statuses (cleared, lapsing, not_cleared) and credential states (the rest). */
export type BadgeStatus =
  "cleared" | "lapsing" | "not_cleared" | "submitted" | "returned" | "verified" | "superseded" | "lapsed";

type StatusBadgeProps =
  { status: "lapsing"; daysLeft: number } | { status: Exclude<BadgeStatus, "lapsing">; daysLeft?: never };

const lapsingWord = (daysLeft: number): string =>
  daysLeft <= 0 ? "Lapsing today" : daysLeft === 1 ? "Lapsing in 1 day" : `Lapsing in ${daysLeft} days`;

// Each status has its own shape as well as its own word, so it never depends on colour alone.
// Shape colours keep at least 3:1 against white (WCAG 1.4.11 non-text contrast).
const shapes: Record<BadgeStatus, ReactNode> = {
  cleared: <circle cx="8" cy="8" r="6" className="fill-emerald-700" />,
  lapsing: (
    <>
      <circle cx="8" cy="8" r="5.25" className="fill-none stroke-amber-700" strokeWidth="1.5" />
      <path d="M8 2.75a5.25 5.25 0 0 1 0 10.5z" className="fill-amber-700" />
    </>
  ),
  not_cleared: (
    <rect x="2.75" y="2.75" width="10.5" height="10.5" className="fill-none stroke-red-700" strokeWidth="2" />
  ),
  submitted: (
    <circle
      cx="8"
      cy="8"
      r="5.25"
      className="fill-none stroke-ink-500"
      strokeWidth="1.75"
      strokeDasharray="2.5 2"
    />
  ),
  returned: <path d="M8 2 14.5 13.5h-13z" className="fill-accent-700" />,
  verified: (
    <>
      <circle cx="8" cy="8" r="6.5" className="fill-emerald-700" />
      <path d="m5 8.25 2 2 4-4.25" className="fill-none stroke-white" strokeWidth="1.75" />
    </>
  ),
  superseded: (
    <path d="M8 2.25 13.75 8 8 13.75 2.25 8z" className="fill-none stroke-ink-500" strokeWidth="1.5" />
  ),
  lapsed: <path d="m3.5 3.5 9 9m0-9-9 9" className="fill-none stroke-red-700" strokeWidth="2.25" />,
};

const words: Record<Exclude<BadgeStatus, "lapsing">, string> = {
  cleared: "Cleared",
  not_cleared: "Not cleared",
  submitted: "Awaiting verification",
  returned: "Returned",
  verified: "Verified",
  superseded: "Superseded",
  lapsed: "Lapsed",
};

const tones: Record<BadgeStatus, string> = {
  cleared: "border-emerald-700/40 bg-emerald-50",
  lapsing: "border-amber-700/40 bg-amber-50",
  not_cleared: "border-red-700/40 bg-red-50",
  submitted: "border-ink-300 bg-white",
  returned: "border-accent-700/40 bg-orange-50",
  verified: "border-emerald-700/40 bg-emerald-50",
  superseded: "border-ink-200 bg-ink-50",
  lapsed: "border-red-700/40 bg-red-50",
};

export const statusWord = (props: StatusBadgeProps): string =>
  props.status === "lapsing" ? lapsingWord(props.daysLeft) : words[props.status];

export function StatusBadge(props: StatusBadgeProps) {
  return (
    <span
      data-status={props.status}
      className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border px-2 py-0.5 text-sm font-medium text-ink-900 ${tones[props.status]}`}
    >
      <svg viewBox="0 0 16 16" className="size-3.5 shrink-0" aria-hidden="true" focusable="false">
        {shapes[props.status]}
      </svg>
      {statusWord(props)}
    </span>
  );
}
