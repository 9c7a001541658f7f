import type { WorkOrderSide } from "../../shared/work-orders/schemas.ts";
import { sideOf } from "../../shared/work-orders/work-order-side.ts";
import { requireOwnership, requireRole, type SignedInUser } from "../http/policy.ts";
import { WorkOrder } from "./model.ts";

export { sideOf };

export async function workOrderSide(user: SignedInUser, workOrderId: unknown): Promise<WorkOrderSide | null> {
  const workOrder = await WorkOrder.findByPk(Number(workOrderId), {
    attributes: ["shopCompanyId", "serviceCompanyId", "technicianId"],
  });
  return workOrder ? sideOf(user, workOrder) : null;
}

const partyRoles = requireRole("buyer", "provider_admin", "technician");

export const canRaiseWorkOrders = requireRole("buyer");
export const canListWorkOrders = partyRoles;

/** Only the two sides see a work order; anyone else gets the same 404 as for a missing one. */
export const canSeeWorkOrder = requireOwnership(
  partyRoles,
  "either side of the work order",
  async (user, params) => (await workOrderSide(user, params.workOrderId)) !== null,
);
