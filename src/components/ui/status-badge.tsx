import { statusMarks, type StatusMeaning } from "@shared/status/status-marks.ts";
import { StatusMark } from "./status-mark.tsx";

/** Every status a person reads; shapes and words come from one shared table (shared/status/status-marks.ts). */
export type BadgeStatus = StatusMeaning;

type StatusBadgeProps =
  | { status: "lapsing"; daysLeft?: number | undefined; word?: never }
  // `word` narrows the status's wording where the rules judged were fewer than the word promises.
  | { status: Exclude<BadgeStatus, "lapsing">; daysLeft?: never; word?: string | undefined };

const lapsingWord = (daysLeft: number | undefined): string =>
  daysLeft === undefined
    ? statusMarks.lapsing.word
    : daysLeft <= 0
      ? "Lapsing today"
      : daysLeft === 1
        ? "Lapsing in 1 day"
        : `Lapsing in ${daysLeft} days`;

// The badge's background follows the shape's colour; the shape, not the colour, tells statuses apart.
const backgrounds: Record<string, string> = {
  [statusMarks.cleared.tone]: "border-emerald-700/40 bg-emerald-50",
  [statusMarks.lapsing.tone]: "border-amber-700/40 bg-amber-50",
  [statusMarks.lapsed.tone]: "border-red-700/40 bg-red-50",
  [statusMarks.returned.tone]: "border-accent-700/40 bg-orange-50",
};
const background = (status: BadgeStatus) =>
  backgrounds[statusMarks[status].tone] ?? "border-ink-300 bg-white";

export const statusWord = (props: StatusBadgeProps): string =>
  props.status === "lapsing" ? lapsingWord(props.daysLeft) : (props.word ?? statusMarks[props.status].word);

export function StatusBadge(props: StatusBadgeProps) {
  return (
    <span
      data-status={props.status}
      className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border px-2 py-0.5 text-sm font-medium text-ink-900 ${background(props.status)}`}
    >
      <StatusMark status={props.status} />
      {statusWord(props)}
    </span>
  );
}
