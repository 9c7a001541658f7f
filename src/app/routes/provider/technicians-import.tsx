import { Link } from "react-router-dom";
import { z } from "zod";
import { useQueryClient } from "@tanstack/react-query";
import { paths } from "@/config/paths.ts";
import { Button } from "@/components/ui/button.tsx";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { FormError } from "@/components/ui/form-error.tsx";
import { ColumnMappingFields } from "@/components/imports/column-mapping-fields.tsx";
import { ImportPageHeader, ImportStep, SpreadsheetFileInput } from "@/components/imports/import-step.tsx";
import { useSpreadsheetImport } from "@/components/imports/use-spreadsheet-import.ts";
import { uploadWithProgress } from "@/lib/upload-with-progress.ts";
import {
  guessMapping,
  importFields,
  technicianImportPreviewSchema,
  technicianImportReportSchema,
  type ColumnMapping,
  type TechnicianImportPreview,
  type TechnicianImportReport,
} from "@shared/technicians/bulk-import.ts";

function formFor(file: File, mapping: ColumnMapping | null) {
  const form = new FormData();
  // None: the server guesses the mapping from the file's headers.
  if (mapping !== null) form.append("mapping", JSON.stringify(mapping));
  form.append("file", file);
  return form;
}

const sender =
  <S extends z.ZodType>(path: string, schema: S) =>
  (file: File, mapping: ColumnMapping | null) =>
    uploadWithProgress({ path, form: formFor(file, mapping), schema });

export function Component() {
  const queryClient = useQueryClient();
  const flow = useSpreadsheetImport<ColumnMapping, TechnicianImportPreview, TechnicianImportReport>(
    guessMapping,
  );
  const { preview, report } = flow;

  const problemRows = preview?.rows.filter((r) => r.problems.length > 0) ?? [];
  return (
    <>
      <ImportPageHeader
        title="Import technicians"
        description="Bring your roster in from a spreadsheet: an Excel workbook (.xlsx) or a CSV file. Match its columns, check every row, then import the rows without problems. Those with an e-mail get an invitation to sign in."
        templatePath="/technicians/import/template"
      />
      <div className="space-y-6">
        <SpreadsheetFileInput
          onChoose={(chosen) =>
            void flow.choose(chosen, sender("/technicians/import/preview", technicianImportPreviewSchema))
          }
        />

        {flow.headers.length > 0 && (
          <ImportStep id="mapping" title="Match the columns">
            <ColumnMappingFields
              fields={importFields}
              headers={flow.headers}
              mapping={flow.mapping ?? {}}
              onChange={flow.setMapping}
            />
            <Button
              pending={flow.pending}
              pendingLabel="Checking…"
              onClick={async () => {
                const result = await flow.run(
                  sender("/technicians/import/preview", technicianImportPreviewSchema),
                );
                if (result) flow.setPreview(result);
              }}
            >
              Check rows
            </Button>
          </ImportStep>
        )}

        <FormError error={flow.error} />

        {preview && !report && (
          <ImportStep id="preview" title="Preview">
            <p className="text-sm text-ink-800">
              {preview.goodCount} {preview.goodCount === 1 ? "row is" : "rows are"} ready to import;{" "}
              {preview.badCount} {preview.badCount === 1 ? "row has" : "rows have"} problems and will be left
              out.
            </p>
            {problemRows.length > 0 && (
              <table className="w-full text-left text-sm">
                <caption className="sr-only">Rows with problems</caption>
                <thead>
                  <tr>
                    <th scope="col" className="py-1 pr-4">
                      Line
                    </th>
                    <th scope="col" className="py-1">
                      Problems
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {problemRows.map((row) => (
                    <tr key={row.line} className="border-t border-ink-200">
                      <td className="py-1 pr-4 align-top">{row.line}</td>
                      <td className="py-1">{row.problems.join("; ")}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            )}
            <Button
              disabled={preview.goodCount === 0}
              pending={flow.pending}
              pendingLabel="Importing…"
              onClick={async () => {
                const result = await flow.run(sender("/technicians/import", technicianImportReportSchema));
                if (result) {
                  flow.setReport(result);
                  void queryClient.invalidateQueries();
                }
              }}
            >
              Import {preview.goodCount} {preview.goodCount === 1 ? "technician" : "technicians"}
            </Button>
          </ImportStep>
        )}

        {report && (
          <ImportStep id="report" title="Import report" status className="space-y-2">
            <p className="text-sm text-ink-800">
              Imported {report.imported}, invited {report.invited} by e-mail, left out {report.skipped.length}
              .
            </p>
            <Link to={paths.provider.technicians} className={buttonStyles("secondary")}>
              Back to technicians
            </Link>
          </ImportStep>
        )}
      </div>
    </>
  );
}
