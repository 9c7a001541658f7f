import type { Role } from "../accounts/schemas.ts";
import type { WorkOrderSide } from "./schemas.ts";

/** The parts of a signed-in user that decide what they may read. */
export interface Viewer {
  id: number;
  role: Role;
  companyId: number;
  technicianId: number | null;
}

export interface WorkOrderParties {
  shopCompanyId: number;
  serviceCompanyId: number;
  technicianId: number;
}

/** The shop's buyers on one side; the service company's admin and the named technician on the other. */
export function sideOf(viewer: Viewer, workOrder: WorkOrderParties): WorkOrderSide | null {
  if (viewer.role === "buyer" && workOrder.shopCompanyId === viewer.companyId) return "shop";
  if (viewer.role === "provider_admin" && workOrder.serviceCompanyId === viewer.companyId) return "service";
  if (
    viewer.role === "technician" &&
    viewer.technicianId !== null &&
    workOrder.technicianId === viewer.technicianId
  )
    return "service";
  return null;
}
