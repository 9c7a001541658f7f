import { Link } from "react-router-dom";
import { hrefs } from "@/config/paths.ts";
import { formatDateTime } from "@/lib/format-date-time.ts";
import type { WorkOrderSummaryDto as WorkOrderSummary } from "@shared/work-orders/schemas.ts";
import { WorkOrderStatusBadge } from "./work-order-status-badge.tsx";
import { urgencyWords } from "./work-order-words.ts";

/** Work orders the service side has not answered yet, oldest first: the shop is waiting on each of them. */
export function WorkOrdersToAnswer({ workOrders }: { workOrders: WorkOrderSummary[] }) {
  if (workOrders.length === 0) {
    return (
      <p className="rounded-lg border border-ink-100 bg-white px-4 py-3 text-sm text-ink-700">
        No work order is waiting for an answer.
      </p>
    );
  }
  const oldestFirst = [...workOrders].sort((a, b) => a.createdAt.localeCompare(b.createdAt));
  return (
    <ul className="space-y-3">
      {oldestFirst.map((w) => (
        <li key={w.id} className="rounded-lg border border-ink-100 bg-white px-4 py-3">
          <div className="flex flex-wrap items-center gap-2">
            <WorkOrderStatusBadge status={w.status} />
            <Link
              to={hrefs.workOrder(w.id)}
              className="font-semibold text-ink-900 underline underline-offset-2"
            >
              Work order #{w.id}
            </Link>
          </div>
          <p className="mt-1 text-sm font-medium text-ink-900">{urgencyWords[w.urgency]}</p>
          <p className="text-sm text-ink-900 break-words">
            {w.shopName}, {w.siteName} · {w.technicianName}
          </p>
          <p className="text-sm text-ink-700">Raised {formatDateTime(w.createdAt)}</p>
        </li>
      ))}
    </ul>
  );
}
