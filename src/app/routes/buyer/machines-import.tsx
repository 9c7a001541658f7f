import { useState } from "react";
import { Link } from "react-router-dom";
import Papa from "papaparse";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import {
  guessMachineMapping,
  machineImportFields,
  type MachineColumnMapping,
  type MachineImportPreview,
  type MachineImportReport,
} from "@shared/machines/machine-import.ts";
import { paths } from "@/config/paths.ts";
import { env } from "@/config/env.ts";
import { Button } from "@/components/ui/button.tsx";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { FormError } from "@/components/ui/form-error.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { sitesQuery } from "@/features/sites/api/get-sites.ts";
import { commitMachineImport, previewMachineImport } from "@/features/machines/api/import-machines.ts";

export function Component() {
  const queryClient = useQueryClient();
  const sites = useQuery(sitesQuery());
  const activeSites = (sites.data ?? []).filter((s) => s.active);
  const [file, setFile] = useState<File | null>(null);
  const [headers, setHeaders] = useState<string[]>([]);
  const [mapping, setMapping] = useState<MachineColumnMapping>({});
  const [siteId, setSiteId] = useState("");
  const [preview, setPreview] = useState<MachineImportPreview | null>(null);
  const [report, setReport] = useState<MachineImportReport | null>(null);
  const [error, setError] = useState<unknown>(null);
  const [pending, setPending] = useState(false);

  async function choose(chosen: File | null) {
    setFile(chosen);
    setPreview(null);
    setReport(null);
    setError(null);
    if (!chosen) return;
    // Only the header row is read here, to offer the columns; the server reads and checks the whole file.
    const firstLine = (await chosen.slice(0, 64 * 1024).text()).replace(/^\uFEFF/, "");
    const found = (Papa.parse<string[]>(firstLine, { preview: 1 }).data[0] ?? []).filter(
      (h) => h.trim() !== "",
    );
    setHeaders(found);
    setMapping(guessMachineMapping(found));
  }

  async function run<T>(send: typeof previewMachineImport | typeof commitMachineImport, skip = false) {
    if (!file) return undefined;
    setPending(true);
    setError(null);
    try {
      return (await send({
        file,
        mapping,
        defaultSiteId: siteId === "" ? null : Number(siteId),
        skipRowsWithProblems: skip,
      })) as T;
    } catch (err) {
      setError(err);
      return undefined;
    } finally {
      setPending(false);
    }
  }

  async function commit(skip: boolean) {
    const result = await run<MachineImportReport>(commitMachineImport, skip);
    if (result) {
      setReport(result);
      void queryClient.invalidateQueries();
    }
  }

  const problems = preview?.rows.flatMap((r) => r.problems) ?? [];
  return (
    <>
      <PageHeader
        title="Import machines"
        description="Bring your machine list in from a spreadsheet saved as CSV. Match its columns, check every row, then import. Builders and controls are matched to the catalog; a machine another shop already holds is found by its builder and serial number."
        actions={
          <a
            href={`${env.VITE_API_BASE}/machines/import/template`}
            className={buttonStyles("secondary")}
            download
          >
            Download template
          </a>
        }
      />
      <div className="space-y-6">
        <label className="block text-sm font-medium text-ink-900">
          CSV file
          <input
            type="file"
            accept=".csv,text/csv"
            className="mt-1 block w-full max-w-full text-sm"
            onChange={(e) => void choose(e.target.files?.[0] ?? null)}
          />
        </label>

        {headers.length > 0 && (
          <section aria-labelledby="mapping-heading" className="space-y-3">
            <h2 id="mapping-heading" className="text-lg font-semibold text-ink-900">
              Match the columns
            </h2>
            <SelectField
              label="Site for rows without one"
              name="defaultSiteId"
              placeholder="No default: every row names its site"
              options={activeSites.map((s) => ({ value: String(s.id), label: s.name }))}
              value={siteId}
              onChange={(e) => {
                setSiteId(e.target.value);
                setPreview(null);
              }}
            />
            <div className="grid gap-3 sm:grid-cols-2">
              {machineImportFields.map((field) => (
                <SelectField
                  key={field.key}
                  label={`${field.header}${field.required ? "" : " (optional)"}`}
                  name={`mapping.${field.key}`}
                  placeholder="Not in this file"
                  options={headers.map((h) => ({ value: h, label: h }))}
                  value={mapping[field.key] ?? ""}
                  onChange={(e) => {
                    const next = { ...mapping };
                    if (e.target.value === "") delete next[field.key];
                    else next[field.key] = e.target.value;
                    setMapping(next);
                    setPreview(null);
                  }}
                />
              ))}
            </div>
            <Button
              pending={pending}
              pendingLabel="Checking…"
              onClick={async () => {
                const result = await run<MachineImportPreview>(previewMachineImport);
                if (result) setPreview(result);
              }}
            >
              Check rows
            </Button>
          </section>
        )}

        <FormError error={error} />

        {preview && !report && (
          <section aria-labelledby="preview-heading" className="space-y-3">
            <h2 id="preview-heading" className="text-lg font-semibold text-ink-900">
              Preview
            </h2>
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
                pending={pending}
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
                  pending={pending}
                  pendingLabel="Importing…"
                  onClick={() => void commit(true)}
                >
                  Import {preview.goodCount} good {preview.goodCount === 1 ? "row" : "rows"}, leave out{" "}
                  {preview.badCount}
                </Button>
              </div>
            )}
          </section>
        )}

        {report && (
          <section aria-labelledby="report-heading" className="space-y-2" role="status">
            <h2 id="report-heading" className="text-lg font-semibold text-ink-900">
              Import report
            </h2>
            <p className="text-sm text-ink-800">
              Imported {report.imported} {report.imported === 1 ? "machine" : "machines"}, left out{" "}
              {report.skipped.length}.
            </p>
            <Link to={paths.buyer.sites} className={buttonStyles("secondary")}>
              Back to sites
            </Link>
          </section>
        )}
      </div>
    </>
  );
}
