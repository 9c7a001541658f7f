export { technicianRoutes } from "./routes.ts";
export { Technician, initTechnicianModel } from "./model.ts";
export { isTechnicianManagedBy } from "./policy.ts";
export { viewLevelOf } from "./visibility.ts";
