import { directoryQuerySchema, technicianProfileQuerySchema } from "../../shared/directory/schemas.ts";
import {
  directoryPageDtoSchema,
  directoryTechnicianDtoSchema,
} from "../../shared/directory/directory-shapes.ts";
import { technicianParamsSchema } from "../../shared/technicians/schemas.ts";
import { createRoutes } from "../http/route.ts";
import { canSearchDirectory, canViewListedTechnician } from "./policy.ts";
import { searchDirectory } from "./search.ts";
import { findDirectoryTechnician } from "./technician-profile.ts";

export const directoryRoutes = createRoutes("/api/directory");

directoryRoutes.get(
  "",
  {
    allow: canSearchDirectory,
    query: directoryQuerySchema,
    reads: "replica",
    response: directoryPageDtoSchema,
  },
  (req, _res, { query }) => searchDirectory(req.user!, query),
);

directoryRoutes.get(
  "/technicians/:technicianId",
  {
    allow: canViewListedTechnician,
    params: technicianParamsSchema,
    query: technicianProfileQuerySchema,
    reads: "replica",
    response: directoryTechnicianDtoSchema,
  },
  (req, _res, { params, query }) =>
    findDirectoryTechnician(req.user!, params.technicianId, query.onSiteHours, new Date(), query.siteId),
);
