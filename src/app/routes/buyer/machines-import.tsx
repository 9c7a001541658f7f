import { useState } from "react";
import { Link } from "react-router-dom";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import {
  guessMachineMapping,
  machineImportFields,
  type MachineColumnMapping,
  type MachineImportPreview,
  type MachineImportReport,
} from "@shared/machines/machine-import.ts";
import { paths } from "@/config/paths.ts";
import { Button } from "@/components/ui/button.tsx";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { FormError } from "@/components/ui/form-error.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { ColumnMappingFields } from "@/components/imports/column-mapping-fields.tsx";
import { ImportPageHeader, ImportStep, SpreadsheetFileInput } from "@/components/imports/import-step.tsx";
import { useSpreadsheetImport } from "@/components/imports/use-spreadsheet-import.ts";
import { sitesQuery } from "@/features/sites/api/get-sites.ts";
import { commitMachineImport, previewMachineImport } from "@/features/machines/api/import-machines.ts";

export function Component() {
  const queryClient = useQueryClient();
  const sites = useQuery(sitesQuery());
  const activeSites = (sites.data ?? []).filter((s) => s.active);
  const [siteId, setSiteId] = useState("");
  const flow = useSpreadsheetImport<MachineColumnMapping, MachineImportPreview, MachineImportReport>(
    guessMachineMapping,
  );
  const { preview, report } = flow;

  const sender =
    <T,>(send: typeof previewMachineImport | typeof commitMachineImport, skip = false) =>
    (file: File, used: MachineColumnMapping | null) =>
      send({
        file,
        mapping: used,
        defaultSiteId: siteId === "" ? null : Number(siteId),
        skipRowsWithProblems: skip,
      }) as Promise<T>;

  async function commit(skip: boolean) {
    const result = await flow.run(sender<MachineImportReport>(commitMachineImport, skip));
    if (result) {
      flow.setReport(result);
      void queryClient.invalidateQueries();
    }
  }

  const problems = preview?.rows.flatMap((r) => r.problems) ?? [];
  return (
    <>
      <ImportPageHeader
        title="Import machines"
        description="Bring your machine list in from a spreadsheet: an Excel workbook (.xlsx) or a CSV file. Match its columns, check every row, then import. Builders and controls are matched to the catalog; a machine another shop already holds is found by its builder and serial number."
        templatePath="/machines/import/template"
      />
      <div className="space-y-6">
        <SpreadsheetFileInput
          onChoose={(chosen) => void flow.choose(chosen, sender<MachineImportPreview>(previewMachineImport))}
        />

        {flow.headers.length > 0 && (
          <ImportStep id="mapping" title="Match the columns">
            <SelectField
              label="Site for rows without one"
              name="defaultSiteId"
              placeholder="No default: every row names its site"
              options={activeSites.map((s) => ({ value: String(s.id), label: s.name }))}
              value={siteId}
              onChange={(e) => {
                setSiteId(e.target.value);
                flow.setPreview(null);
              }}
            />
            <ColumnMappingFields
              fields={machineImportFields}
              headers={flow.headers}
              mapping={flow.mapping ?? {}}
              onChange={flow.setMapping}
            />
            <Button
              pending={flow.pending}
              pendingLabel="Checking…"
              onClick={async () => {
                const result = await flow.run(sender<MachineImportPreview>(previewMachineImport));
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
              {preview.goodCount} {preview.goodCount === 1 ? "row is" : "rows are"} ready; {preview.badCount}{" "}
              {preview.badCount === 1 ? "row has" : "rows have"} problems.
            </p>
            {problems.length > 0 && (
              <div className="overflow-x-auto">
                <table className="w-full text-left text-sm">
                  <caption className="sr-only">Problems by row and column</caption>
                  <thead>
                    <tr>
                      <th scope="col" className="py-1 pr-3">
                        Row
                      </th>
                      <th scope="col" className="py-1 pr-3">
                        Column
                      </th>
                      <th scope="col" className="py-1">
                        Problem
                      </th>
                    </tr>
                  </thead>
                  <tbody>
                    {problems.map((p, i) => (
                      <tr key={`${p.line}-${p.field}-${i}`} className="border-t border-ink-200 align-top">
                        <td className="py-1 pr-3">{p.line}</td>
                        <td className="break-words py-1 pr-3">{p.column}</td>
                        <td className="break-words py-1">{p.reason}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            )}
            {preview.badCount === 0 ? (
              <Button
                disabled={preview.goodCount === 0}
                pending={flow.pending}
                pendingLabel="Importing…"
                onClick={() => void commit(false)}
              >
                Import {preview.goodCount} {preview.goodCount === 1 ? "machine" : "machines"}
              </Button>
            ) : (
              <div className="space-y-2">
                <p className="text-sm text-ink-800">
                  Fix these rows in your spreadsheet and check again, or import only the rows without
                  problems.
                </p>
                <Button
                  disabled={preview.goodCount === 0}
                  pending={flow.pending}
                  pendingLabel="Importing…"
                  onClick={() => void commit(true)}
                >
                  Import {preview.goodCount} good {preview.goodCount === 1 ? "row" : "rows"}, leave out{" "}
                  {preview.badCount}
                </Button>
              </div>
            )}
          </ImportStep>
        )}

        {report && (
          <ImportStep id="report" title="Import report" status className="space-y-2">
            <p className="text-sm text-ink-800">
              Imported {report.imported} {report.imported === 1 ? "machine" : "machines"}, left out{" "}
              {report.skipped.length}.
            </p>
            <Link to={paths.buyer.sites} className={buttonStyles("secondary")}>
              Back to sites
            </Link>
          </ImportStep>
        )}
      </div>
    </>
  );
}
