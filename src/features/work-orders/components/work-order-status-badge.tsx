import type { ReactNode } from "react";
import type { WorkOrderStatus } from "@shared/work-orders/schemas.ts";

// Each status has a shape and a word, never colour alone; shapes keep 3:1 against white.
const shapes: Record<WorkOrderStatus, ReactNode> = {
  requested: (
    <circle
      cx="8"
      cy="8"
      r="5.25"
      className="fill-none stroke-ink-500"
      strokeWidth="1.75"
      strokeDasharray="2.5 2"
    />
  ),
  accepted: (
    <>
      <circle cx="8" cy="8" r="5.25" className="fill-none stroke-ink-700" strokeWidth="1.5" />
      <path d="M8 2.75a5.25 5.25 0 0 1 0 10.5z" className="fill-ink-700" />
    </>
  ),
  declined: <path d="m3.5 3.5 9 9m0-9-9 9" className="fill-none stroke-red-700" strokeWidth="2.25" />,
  completed: (
    <>
      <circle cx="8" cy="8" r="5.75" className="fill-none stroke-emerald-700" strokeWidth="1.5" />
      <path d="m5 8.25 2 2 4-4.25" className="fill-none stroke-emerald-700" strokeWidth="1.75" />
    </>
  ),
  confirmed: (
    <>
      <circle cx="8" cy="8" r="6.5" className="fill-emerald-700" />
      <path d="m5 8.25 2 2 4-4.25" className="fill-none stroke-white" strokeWidth="1.75" />
    </>
  ),
};

export const workOrderStatusWords: Record<WorkOrderStatus, string> = {
  requested: "Requested",
  accepted: "Accepted",
  declined: "Declined",
  completed: "Completed",
  confirmed: "Confirmed",
};

const tones: Record<WorkOrderStatus, string> = {
  requested: "border-ink-300 bg-white",
  accepted: "border-ink-300 bg-ink-50",
  declined: "border-red-700/40 bg-red-50",
  completed: "border-emerald-700/40 bg-white",
  confirmed: "border-emerald-700/40 bg-emerald-50",
};

export function WorkOrderStatusBadge({ status }: { status: WorkOrderStatus }) {
  return (
    <span
      data-status={status}
      className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border px-2 py-0.5 text-sm font-medium text-ink-900 ${tones[status]}`}
    >
      <svg viewBox="0 0 16 16" className="size-3.5 shrink-0" aria-hidden="true" focusable="false">
        {shapes[status]}
      </svg>
      {workOrderStatusWords[status]}
    </span>
  );
}
