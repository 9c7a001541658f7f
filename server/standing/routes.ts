import { z } from "zod";
import {
  baselineDtoSchema,
  baselineInputSchema,
  jobRunDtoSchema,
  requirementSetDtoSchema,
  requirementSetPreviewDtoSchema,
  technicianStandingDtoSchema,
  listRequirementSetsQuerySchema,
  requirementSetInputSchema,
  requirementSetParamsSchema,
  technicianStandingParamsSchema,
} from "../../shared/standing/schemas.ts";
import { createRoutes } from "../http/route.ts";
import { readBaseline, reviseBaseline } from "./baseline.ts";
import { listJobRuns } from "./job-runs.ts";
import {
  canEditBaseline,
  canListRequirementSets,
  canManageRequirementSet,
  canReadBaseline,
  canReadJobRuns,
  canViewTechnicianStanding,
} from "./policy.ts";
import {
  archiveRequirementSet,
  defineRequirementSet,
  findRequirementSet,
  listRequirementSets,
  previewRequirementSet,
  previewUnsavedRequirementSet,
  reviseRequirementSet,
} from "./requirement-sets.ts";
import { readTechnicianStanding } from "./technician-standing.ts";

export const standingRoutes = createRoutes("/api");

standingRoutes.get("/baseline", { allow: canReadBaseline, response: baselineDtoSchema }, () =>
  readBaseline(),
);

standingRoutes.put(
  "/admin/baseline",
  { allow: canEditBaseline, body: baselineInputSchema, response: baselineDtoSchema },
  (req, _res, { body }) => reviseBaseline(req.user!, body),
);

standingRoutes.get("/admin/job-runs", { allow: canReadJobRuns, response: z.array(jobRunDtoSchema) }, () =>
  listJobRuns(),
);

standingRoutes.get(
  "/requirement-sets",
  {
    allow: canListRequirementSets,
    query: listRequirementSetsQuerySchema,
    response: z.array(requirementSetDtoSchema),
  },
  (req, _res, { query }) => listRequirementSets(req.user!, query.includeArchived),
);

standingRoutes.post(
  "/requirement-sets",
  {
    allow: canListRequirementSets,
    body: requirementSetInputSchema,
    response: requirementSetDtoSchema,
    status: 201,
  },
  (req, _res, { body }) => defineRequirementSet(req.user!, body),
);

standingRoutes.post(
  "/requirement-sets/preview",
  {
    allow: canListRequirementSets,
    body: requirementSetInputSchema,
    response: requirementSetPreviewDtoSchema,
  },
  (_req, _res, { body }) => previewUnsavedRequirementSet(body),
);

standingRoutes.get(
  "/requirement-sets/:requirementSetId",
  { allow: canManageRequirementSet, params: requirementSetParamsSchema, response: requirementSetDtoSchema },
  (req, _res, { params }) => findRequirementSet(req.user!, params.requirementSetId),
);

standingRoutes.put(
  "/requirement-sets/:requirementSetId",
  {
    allow: canManageRequirementSet,
    params: requirementSetParamsSchema,
    body: requirementSetInputSchema,
    response: requirementSetDtoSchema,
  },
  (req, _res, { params, body }) => reviseRequirementSet(req.user!, params.requirementSetId, body),
);

standingRoutes.delete(
  "/requirement-sets/:requirementSetId",
  { allow: canManageRequirementSet, params: requirementSetParamsSchema, response: requirementSetDtoSchema },
  (req, _res, { params }) => archiveRequirementSet(req.user!, params.requirementSetId),
);

standingRoutes.get(
  "/requirement-sets/:requirementSetId/preview",
  {
    allow: canManageRequirementSet,
    params: requirementSetParamsSchema,
    response: requirementSetPreviewDtoSchema,
  },
  (req, _res, { params }) => previewRequirementSet(req.user!, params.requirementSetId),
);

standingRoutes.get(
  "/technicians/:technicianId/standing",
  {
    allow: canViewTechnicianStanding,
    params: technicianStandingParamsSchema,
    response: technicianStandingDtoSchema,
  },
  (req, _res, { params }) => readTechnicianStanding(params.technicianId, req.user),
);
