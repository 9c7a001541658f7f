import { Router } from "express";
import type { Sequelize } from "sequelize";
import { initNoticeModels, noticeRoutes } from "../notices/index.ts";
import { initStandingTables } from "./model.ts";
import { standingRoutes } from "./routes.ts";

export {
  refreshStandingsForHolder,
  refreshStandings,
  refreshAllStandings,
  refreshStandingsForRequirementSet,
  type Holder,
} from "./refresh-standing.ts";
export {
  onStandingsChanged,
  emitStandingsChanged,
  type ChangedStanding,
  type StandingsChangedListener,
} from "./standing-hooks.ts";
export { checkStandingConsistency, type StandingDifference } from "./consistency-check.ts";
export { countStatements, selectRows, runStatement } from "./sql.ts";
export { lapsingWindowDays } from "./standing-window.ts";
export { JobRun, RequirementSet, PlatformBaseline } from "./model.ts";

/** The standing and notifications routes, mounted by the app as one entry. */
export const standingApiRoutes = { router: Router().use(standingRoutes.router, noticeRoutes.router) };

/** Registers the standing, job-run and notification models. */
export function initStandingModels(sequelize: Sequelize): void {
  initStandingTables(sequelize);
  initNoticeModels(sequelize);
}
