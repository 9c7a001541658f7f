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
export { lapsingWindowDays } from "./standing-window.ts";
export { JobRun, RequirementSet, PlatformBaseline } from "./model.ts";

export { standingRoutes } from "./routes.ts";
