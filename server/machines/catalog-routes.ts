import { z } from "zod";
import {
  catalogEntryDtoSchema,
  catalogEntryInputSchema,
  catalogEntryParamsSchema,
  catalogListQuerySchema,
} from "../../shared/machines/catalog.ts";
import { createRoutes } from "../http/route.ts";
import { requireRole, signedIn } from "../http/policy.ts";
import { addCatalogEntry, editCatalogEntry, listCatalog } from "./catalog-service.ts";

export const machineCatalogRoutes = createRoutes("/api/machine-catalog");

// Every form that names a builder or control picks from this list, so every signed-in role reads it.
machineCatalogRoutes.get(
  "",
  { allow: signedIn, query: catalogListQuerySchema, response: z.array(catalogEntryDtoSchema) },
  (_req, _res, { query }) => listCatalog(query.kind),
);

machineCatalogRoutes.post(
  "",
  {
    allow: requireRole("admin"),
    body: catalogEntryInputSchema,
    response: catalogEntryDtoSchema,
    status: 201,
  },
  (req, _res, { body }) => addCatalogEntry(req.user!, body),
);

machineCatalogRoutes.put(
  "/:entryId",
  {
    allow: requireRole("admin"),
    params: catalogEntryParamsSchema,
    body: catalogEntryInputSchema,
    response: catalogEntryDtoSchema,
  },
  (req, _res, { params, body }) => editCatalogEntry(req.user!, params.entryId, body),
);
