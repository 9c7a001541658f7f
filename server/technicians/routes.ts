import { invitedUserDtoSchema } from "../../shared/accounts/schemas.ts";
import { z } from "zod";
import {
  technicianDtoSchema,
  technicianInputSchema,
  technicianParamsSchema,
  technicianViewDtoSchema,
} from "../../shared/technicians/schemas.ts";
import { emailSchema } from "../../shared/accounts/schemas.ts";
import { createRoutes } from "../http/route.ts";
import { linkBase } from "../http/app-locals.ts";
import { kickOutbox } from "../mail/outbox.ts";
import { singleFileUpload } from "../http/upload.ts";
import {
  importTemplateCsv,
  technicianImportPreviewSchema,
  technicianImportReportSchema,
} from "../../shared/technicians/bulk-import.ts";
import { singleLineText } from "../../shared/api/text.ts";
import { previewImport, runImport } from "./bulk-import.ts";
import {
  canEditTechnician,
  canListOwnTechnicians,
  canManageTechnicians,
  canViewTechnician,
} from "./policy.ts";
import {
  addTechnician,
  editTechnician,
  findTechnicianFor,
  inviteTechnicianAccount,
  listCompanyTechnicians,
  setTechnicianActive,
} from "./service.ts";

export const technicianRoutes = createRoutes("/api/technicians");

technicianRoutes.get("", { allow: canListOwnTechnicians, response: z.array(technicianDtoSchema) }, (req) =>
  listCompanyTechnicians(req.user!.companyId),
);

const importBodySchema = z.object({ mapping: singleLineText().max(5_000).optional() });

technicianRoutes.get("/import/template", { allow: canManageTechnicians }, (_req, res) => {
  res.type("text/csv").attachment("technicians-template.csv").send(importTemplateCsv());
});

technicianRoutes.post(
  "/import/preview",
  {
    allow: canManageTechnicians,
    before: [singleFileUpload],
    body: importBodySchema,
    response: technicianImportPreviewSchema,
  },
  (req, _res, { body }) => previewImport(req.user!, req.file, body.mapping),
);

technicianRoutes.post(
  "/import",
  {
    allow: canManageTechnicians,
    before: [singleFileUpload],
    body: importBodySchema,
    response: technicianImportReportSchema,
    status: 201,
  },
  async (req, _res, { body }) => {
    const report = await runImport(req.user!, req.file, body.mapping, linkBase(req));
    kickOutbox(req.app.locals);
    return report;
  },
);

technicianRoutes.post(
  "",
  { allow: canManageTechnicians, body: technicianInputSchema, response: technicianDtoSchema, status: 201 },
  (req, _res, { body }) => addTechnician(req.user!, body),
);

technicianRoutes.get(
  "/:technicianId",
  { allow: canViewTechnician, params: technicianParamsSchema, response: technicianViewDtoSchema },
  (req, _res, { params }) => findTechnicianFor(req.user!, params.technicianId),
);

technicianRoutes.put(
  "/:technicianId",
  {
    allow: canEditTechnician,
    params: technicianParamsSchema,
    body: technicianInputSchema,
    response: technicianDtoSchema,
  },
  (req, _res, { params, body }) => editTechnician(req.user!, params.technicianId, body),
);

technicianRoutes.post(
  "/:technicianId/deactivate",
  { allow: canEditTechnician, params: technicianParamsSchema, response: technicianDtoSchema },
  (req, _res, { params }) => setTechnicianActive(req.user!, params.technicianId, false),
);

technicianRoutes.post(
  "/:technicianId/reactivate",
  { allow: canEditTechnician, params: technicianParamsSchema, response: technicianDtoSchema },
  (req, _res, { params }) => setTechnicianActive(req.user!, params.technicianId, true),
);

// Gives the technician a sign-in of their own, linked to this record, by an e-mailed one-time link.
technicianRoutes.post(
  "/:technicianId/account",
  {
    allow: canEditTechnician,
    params: technicianParamsSchema,
    body: z.object({ email: emailSchema }),
    response: invitedUserDtoSchema,
  },
  async (req, res, { params, body }) => {
    const user = await inviteTechnicianAccount(req.user!, params.technicianId, body.email, linkBase(req));
    kickOutbox(req.app.locals);
    res.status(201);
    return user;
  },
);
