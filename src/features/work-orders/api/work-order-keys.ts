import type { WorkOrderStatus } from "@shared/work-orders/schemas.ts";

export const workOrderKeys = {
  all: ["work-orders"] as const,
  list: (status: WorkOrderStatus | null) => [...workOrderKeys.all, "list", status] as const,
  detail: (id: number) => [...workOrderKeys.all, "detail", id] as const,
  messages: (id: number) => [...workOrderKeys.all, "messages", id] as const,
};

/** The printable proof of standing, answered by the server as a page of its own. */
export const standingProofUrl = (id: number, at: "accepted" | "completed") =>
  `/api/work-orders/${id}/standing-proof?at=${at}`;
