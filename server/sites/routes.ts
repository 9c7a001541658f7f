import { z } from "zod";
import {
  equipmentDtoSchema,
  equipmentInputSchema,
  equipmentParamsSchema,
  listSitesQuerySchema,
  postalCodeParamsSchema,
  siteDtoSchema,
  siteInputSchema,
  siteParamsSchema,
} from "../../shared/sites/schemas.ts";
import { postalPlaceDtoSchema } from "../../shared/geo/schemas.ts";
import { createRoutes } from "../http/route.ts";
import {
  canAddSite,
  canListSites,
  canLookUpPostalCode,
  canManageEquipment,
  canManageSite,
} from "./policy.ts";
import {
  addEquipment,
  addSite,
  archiveSite,
  editEquipment,
  editSite,
  findPostalPlace,
  findSite,
  listShopSites,
  listSiteEquipment,
  removeEquipment,
} from "./service.ts";

export const siteRoutes = createRoutes("/api/sites");

siteRoutes.get(
  "",
  { allow: canListSites, query: listSitesQuerySchema, response: z.array(siteDtoSchema) },
  (req, _res, { query }) => listShopSites(req.user!.companyId, query.includeArchived),
);

siteRoutes.post(
  "",
  { allow: canAddSite, body: siteInputSchema, response: siteDtoSchema, status: 201 },
  (req, _res, { body }) => addSite(req.user!, body),
);

siteRoutes.get(
  "/:siteId",
  { allow: canManageSite, params: siteParamsSchema, response: siteDtoSchema },
  (_req, _res, { params }) => findSite(params.siteId),
);

siteRoutes.put(
  "/:siteId",
  { allow: canManageSite, params: siteParamsSchema, body: siteInputSchema, response: siteDtoSchema },
  (req, _res, { params, body }) => editSite(req.user!, params.siteId, body),
);

siteRoutes.delete(
  "/:siteId",
  { allow: canManageSite, params: siteParamsSchema },
  async (req, _res, { params }) => {
    await archiveSite(req.user!, params.siteId);
  },
);

siteRoutes.get(
  "/:siteId/equipment",
  { allow: canManageSite, params: siteParamsSchema, response: z.array(equipmentDtoSchema) },
  (_req, _res, { params }) => listSiteEquipment(params.siteId),
);

siteRoutes.post(
  "/:siteId/equipment",
  {
    allow: canManageSite,
    params: siteParamsSchema,
    body: equipmentInputSchema,
    response: equipmentDtoSchema,
    status: 201,
  },
  (req, _res, { params, body }) => addEquipment(req.user!, params.siteId, body),
);

siteRoutes.put(
  "/:siteId/equipment/:equipmentId",
  {
    allow: canManageEquipment,
    params: equipmentParamsSchema,
    body: equipmentInputSchema,
    response: equipmentDtoSchema,
  },
  (req, _res, { params, body }) => editEquipment(req.user!, params.equipmentId, body),
);

siteRoutes.delete(
  "/:siteId/equipment/:equipmentId",
  { allow: canManageEquipment, params: equipmentParamsSchema },
  async (req, _res, { params }) => {
    await removeEquipment(req.user!, params.equipmentId);
  },
);

export const postalCodeRoutes = createRoutes("/api/postal-codes");

postalCodeRoutes.get(
  "/:code",
  { allow: canLookUpPostalCode, params: postalCodeParamsSchema, response: postalPlaceDtoSchema },
  (_req, _res, { params }) => findPostalPlace(params.code),
);
