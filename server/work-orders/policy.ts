import type { WorkOrderSide } from "../../shared/work-orders/schemas.ts";
import { requireOwnership, requireRole, type SignedInUser } from "../http/policy.ts";
import { WorkOrder } from "./model.ts";

/** The shop's buyers on one side; the service company's admin and the named technician on the other. */
export function sideOf(
  user: SignedInUser,
  workOrder: Pick<WorkOrder, "shopCompanyId" | "serviceCompanyId" | "technicianId">,
): WorkOrderSide | null {
  if (user.role === "buyer" && workOrder.shopCompanyId === user.companyId) return "shop";
  if (user.role === "provider_admin" && workOrder.serviceCompanyId === user.companyId) return "service";
  if (
    user.role === "technician" &&
    user.technicianId !== null &&
    workOrder.technicianId === user.technicianId
  )
    return "service";
  return null;
}

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
