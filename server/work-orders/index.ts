export { workOrderRoutes } from "./routes.ts";
export { WorkOrder, initWorkOrderModels } from "./model.ts";
export { sideOf } from "./policy.ts";
