import type { ReactNode } from "react";
import type { EstimateStatus, RequestStatus } from "@shared/service-requests/schemas.ts";

type Status = RequestStatus | EstimateStatus;

const words: Record<Status, string> = {
  open: "Open",
  decided: "Decided",
  cancelled: "Cancelled",
  expired: "Expired",
  active: "Sent",
  withdrawn: "Withdrawn",
  accepted: "Accepted",
  not_chosen: "Not chosen",
};

// A shape as well as a word for every status, so none depends on colour alone.
const shapes: Record<Status, ReactNode> = {
  open: <circle cx="8" cy="8" r="5" fill="none" stroke="currentColor" strokeWidth="2" />,
  decided: <path d="M3 8.5l3 3 7-7" fill="none" stroke="currentColor" strokeWidth="2" />,
  cancelled: <path d="M4 4l8 8M12 4l-8 8" stroke="currentColor" strokeWidth="2" />,
  expired: <path d="M8 3v5l3 2" fill="none" stroke="currentColor" strokeWidth="2" />,
  active: <path d="M3 8h10M9 4l4 4-4 4" fill="none" stroke="currentColor" strokeWidth="2" />,
  withdrawn: <path d="M13 8H3M7 4L3 8l4 4" fill="none" stroke="currentColor" strokeWidth="2" />,
  accepted: <path d="M3 8.5l3 3 7-7" fill="none" stroke="currentColor" strokeWidth="2" />,
  not_chosen: <rect x="4" y="7" width="8" height="2" fill="currentColor" />,
};

const tones: Record<Status, string> = {
  open: "border-sky-700/40 bg-sky-50",
  decided: "border-emerald-700/40 bg-emerald-50",
  cancelled: "border-ink-300 bg-ink-50",
  expired: "border-ink-300 bg-ink-50",
  active: "border-sky-700/40 bg-sky-50",
  withdrawn: "border-ink-300 bg-ink-50",
  accepted: "border-emerald-700/40 bg-emerald-50",
  not_chosen: "border-ink-300 bg-ink-50",
};

export function RequestStatusBadge({ status }: { status: Status }) {
  return (
    <span
      data-status={status}
      className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border px-2 py-0.5 text-sm font-medium text-ink-900 ${tones[status]}`}
    >
      <svg viewBox="0 0 16 16" className="size-3.5 shrink-0" aria-hidden="true" focusable="false">
        {shapes[status]}
      </svg>
      {words[status]}
    </span>
  );
}
