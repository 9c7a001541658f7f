import { raisedMaintenanceRequestSchema } from "../../shared/machines/maintenance-schemas.ts";
import {
  hourReadingInputSchema,
  maintenancePlanListSchema,
  maintenancePlanSchema,
  machineParamsSchema,
  maintenancePlanInputSchema,
  maintenancePlanParamsSchema,
  maintenanceRequestInputSchema,
} from "../../shared/machines/maintenance-schemas.ts";
import { createRoutes } from "../http/route.ts";
import { requireOwnership, requireRole } from "../http/policy.ts";
import { linkBase } from "../http/app-locals.ts";
import { kickOutbox } from "../mail/index.ts";
import {
  addPlan,
  changePlan,
  isShopMachine,
  listPlans,
  recordHourReading,
  removePlan,
} from "./maintenance-plans.ts";
import { requestPlannedService } from "./maintenance-requests.ts";

export const maintenanceRoutes = createRoutes("/api/machines");

// Only the shop the machine stands at; another shop's machine answers 404 like a missing one.
const canPlanMaintenance = requireOwnership(
  requireRole("buyer"),
  "a machine at a site of the buyer's shop",
  (user, params) => isShopMachine(user.companyId, Number(params.machineId)),
);

maintenanceRoutes.get(
  "/:machineId/maintenance-plans",
  { allow: canPlanMaintenance, params: machineParamsSchema, response: maintenancePlanListSchema },
  (req, _res, { params }) => listPlans(req.user!, params.machineId),
);

maintenanceRoutes.post(
  "/:machineId/maintenance-plans",
  {
    allow: canPlanMaintenance,
    params: machineParamsSchema,
    body: maintenancePlanInputSchema,
    response: maintenancePlanSchema,
    status: 201,
  },
  (req, _res, { params, body }) => addPlan(req.user!, params.machineId, body),
);

maintenanceRoutes.put(
  "/:machineId/maintenance-plans/:planId",
  {
    allow: canPlanMaintenance,
    params: maintenancePlanParamsSchema,
    body: maintenancePlanInputSchema,
    response: maintenancePlanSchema,
  },
  (req, _res, { params, body }) => changePlan(req.user!, params.machineId, params.planId, body),
);

maintenanceRoutes.delete(
  "/:machineId/maintenance-plans/:planId",
  { allow: canPlanMaintenance, params: maintenancePlanParamsSchema },
  (req, _res, { params }) => removePlan(req.user!, params.machineId, params.planId),
);

maintenanceRoutes.post(
  "/:machineId/hour-readings",
  {
    allow: canPlanMaintenance,
    params: machineParamsSchema,
    body: hourReadingInputSchema,
    response: maintenancePlanListSchema,
    status: 201,
  },
  (req, _res, { params, body }) => recordHourReading(req.user!, params.machineId, body),
);

maintenanceRoutes.post(
  "/:machineId/maintenance-plans/:planId/service-request",
  {
    allow: canPlanMaintenance,
    params: maintenancePlanParamsSchema,
    body: maintenanceRequestInputSchema,
    response: raisedMaintenanceRequestSchema,
  },
  async (req, res, { params, body }) => {
    const raised = await requestPlannedService(
      req.user!,
      params.machineId,
      params.planId,
      body,
      linkBase(req),
    );
    kickOutbox(req.app.locals);
    res.status(201);
    return raised;
  },
);
