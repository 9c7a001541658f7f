import type { WorkOrderStatus } from "@shared/work-orders/schemas.ts";
import { statusMarks } from "@shared/status/status-marks.ts";
import { StatusBadge } from "@/components/ui/status-badge.tsx";

export const workOrderStatusWords: Record<WorkOrderStatus, string> = {
  requested: statusMarks.requested.word,
  accepted: statusMarks.accepted.word,
  declined: statusMarks.declined.word,
  completed: statusMarks.completed.word,
  disputed: statusMarks.disputed.word,
  confirmed: statusMarks.confirmed.word,
  cancelled: statusMarks.cancelled.word,
};

/** A work order's status: its own shapes, none shared with a credential's or a technician's standing. */
export function WorkOrderStatusBadge({ status }: { status: WorkOrderStatus }) {
  return <StatusBadge status={status} />;
}
