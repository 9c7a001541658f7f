import {
  machineImportPreviewSchema,
  machineImportReportSchema,
  type MachineColumnMapping,
} from "@shared/machines/machine-import.ts";
import { uploadWithProgress } from "@/lib/upload-with-progress.ts";

type ImportForm = {
  file: File;
  /** None: the server guesses the mapping from the file's headers. */
  mapping: MachineColumnMapping | null;
  defaultSiteId: number | null;
  skipRowsWithProblems?: boolean;
};

function formFor({ file, mapping, defaultSiteId, skipRowsWithProblems }: ImportForm) {
  const form = new FormData();
  if (mapping !== null) form.append("mapping", JSON.stringify(mapping));
  if (defaultSiteId !== null) form.append("defaultSiteId", String(defaultSiteId));
  if (skipRowsWithProblems) form.append("skipRowsWithProblems", "true");
  form.append("file", file);
  return form;
}

export const previewMachineImport = (input: ImportForm) =>
  uploadWithProgress({
    path: "/machines/import/preview",
    form: formFor(input),
    schema: machineImportPreviewSchema,
  });

export const commitMachineImport = (input: ImportForm) =>
  uploadWithProgress({ path: "/machines/import", form: formFor(input), schema: machineImportReportSchema });
