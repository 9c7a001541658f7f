import { z } from "zod";
import { singleLineText } from "../../shared/api/text.ts";
import {
  machineImportPreviewSchema,
  machineImportReportSchema,
  machineImportTemplateCsv,
} from "../../shared/machines/machine-import.ts";
import { createRoutes } from "../http/route.ts";
import { requireRole } from "../http/policy.ts";
import { singleFileUpload } from "../http/upload.ts";
import { commitMachineImport, previewMachineImport } from "./import-service.ts";

export const machineImportRoutes = createRoutes("/api/machines/import");

const canImportMachines = requireRole("buyer");

// Multipart fields arrive as text: the site id and the flag are read from their strings.
const importBodySchema = z.object({
  mapping: singleLineText().max(5_000).optional(),
  defaultSiteId: z.coerce.number().int().positive().max(2_147_483_647).optional(),
  skipRowsWithProblems: z
    .enum(["true", "false"])
    .default("false")
    .transform((v) => v === "true"),
});

machineImportRoutes.get("/template", { allow: canImportMachines }, (_req, res) => {
  res.type("text/csv").attachment("machines-template.csv").send(machineImportTemplateCsv());
});

machineImportRoutes.post(
  "/preview",
  {
    allow: canImportMachines,
    before: [singleFileUpload],
    body: importBodySchema,
    response: machineImportPreviewSchema,
  },
  (req, _res, { body }) => previewMachineImport(req.user!, req.file, body),
);

machineImportRoutes.post(
  "",
  {
    allow: canImportMachines,
    before: [singleFileUpload],
    body: importBodySchema,
    response: machineImportReportSchema,
    status: 201,
  },
  (req, _res, { body }) => commitMachineImport(req.user!, req.file, body),
);
