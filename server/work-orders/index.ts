export { workOrderRoutes } from "./routes.ts";
export { WorkOrder, initWorkOrderModels } from "./model.ts";
export { sideOf } from "./policy.ts";
export { raiseWorkOrderWithin } from "./raise-work-order.ts";
export { toWorkOrderDto } from "./dto.ts";
export { standingSnapshotNow } from "./standing-now.ts";
