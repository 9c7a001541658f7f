import type { WhereOptions } from "sequelize";
import type { WorkOrderStatus } from "../../shared/work-orders/schemas.ts";
import { AppError } from "../http/app-error.ts";
import { WorkOrder } from "./model.ts";
import { sideOf } from "./policy.ts";
import { toWorkOrderDto, toWorkOrderSummaries } from "./dto.ts";

const LIST_LIMIT = 200;

/** Whose work orders a user sees: the shop's for a buyer, the company's for its admin, their own for a technician. */
function scopeOf(user: Express.User): WhereOptions<WorkOrder> {
  if (user.role === "buyer") return { shopCompanyId: user.companyId };
  if (user.role === "provider_admin") return { serviceCompanyId: user.companyId };
  if (user.role === "technician" && user.technicianId !== null) return { technicianId: user.technicianId };
  throw new AppError("forbidden", "Your role has no work orders");
}

export async function listWorkOrders(user: Express.User, status: WorkOrderStatus | undefined) {
  const rows = await WorkOrder.findAll({
    where: { ...scopeOf(user), ...(status ? { status } : {}) },
    order: [
      ["createdAt", "DESC"],
      ["id", "DESC"],
    ],
    limit: LIST_LIMIT,
  });
  return toWorkOrderSummaries(rows);
}

/** The work order and the caller's side of it; the route's policy has already refused outsiders. */
export async function loadForSide(user: Express.User, id: number) {
  const row = await WorkOrder.findByPk(id);
  const side = row ? sideOf(user, row) : null;
  if (!row || !side) throw new AppError("not_found", "That work order was not found");
  return { row, side };
}

export async function findWorkOrder(user: Express.User, id: number) {
  const { row, side } = await loadForSide(user, id);
  return toWorkOrderDto(row, side);
}
