import { registerRosterAlerts } from "./alerts.ts";

export { rosterRoutes } from "./routes.ts";
export { formulaStart } from "./csv-export.ts";
export {
  alertRosteredShops,
  alertOnBaselineChanges,
  sweepRosterAlerts,
  registerRosterAlerts,
  setRosterAlertLinkBase,
} from "./alerts.ts";

// Whoever loads the roster module (the app) hears standing changes; registering twice is a no-op.
registerRosterAlerts();
