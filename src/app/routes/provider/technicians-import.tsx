import { useState } from "react";
import { Link } from "react-router-dom";
import Papa from "papaparse";
import { z } from "zod";
import { useQueryClient } from "@tanstack/react-query";
import { paths } from "@/config/paths.ts";
import { env } from "@/config/env.ts";
import { Button } from "@/components/ui/button.tsx";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { FormError } from "@/components/ui/form-error.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { uploadWithProgress } from "@/lib/upload-with-progress.ts";
import { guessMapping, importFields, type ColumnMapping } from "@shared/technicians/bulk-import.ts";

const previewSchema = z.object({
  goodCount: z.number(),
  badCount: z.number(),
  rows: z.array(
    z.object({
      line: z.number(),
      name: z.string(),
      email: z.string().nullable(),
      problems: z.array(z.string()),
    }),
  ),
});
const reportSchema = z.object({
  imported: z.number(),
  invited: z.number(),
  skipped: z.array(z.object({ line: z.number(), problems: z.array(z.string()) })),
});

function formFor(file: File, mapping: ColumnMapping) {
  const form = new FormData();
  form.append("mapping", JSON.stringify(mapping));
  form.append("file", file);
  return form;
}

export function Component() {
  const queryClient = useQueryClient();
  const [file, setFile] = useState<File | null>(null);
  const [headers, setHeaders] = useState<string[]>([]);
  const [mapping, setMapping] = useState<ColumnMapping>({});
  const [preview, setPreview] = useState<z.infer<typeof previewSchema> | null>(null);
  const [report, setReport] = useState<z.infer<typeof reportSchema> | null>(null);
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
    setMapping(guessMapping(found));
  }

  async function send<S extends z.ZodType>(path: string, schema: S) {
    if (!file) return undefined;
    setPending(true);
    setError(null);
    try {
      return await uploadWithProgress({ path, form: formFor(file, mapping), schema });
    } catch (err) {
      setError(err);
      return undefined;
    } finally {
      setPending(false);
    }
  }

  const problemRows = preview?.rows.filter((r) => r.problems.length > 0) ?? [];
  return (
    <>
      <PageHeader
        title="Import technicians"
        description="Bring your roster in from a spreadsheet: an Excel workbook (.xlsx) or a CSV file. Match its columns, check every row, then import the rows without problems. Those with an e-mail get an invitation to sign in."
        actions={
          <a
            href={`${env.VITE_API_BASE}/technicians/import/template`}
            className={buttonStyles("secondary")}
            download
          >
            Download template
          </a>
        }
      />
      <div className="space-y-6">
        <label className="block text-sm font-medium text-ink-900">
          Spreadsheet (.xlsx or CSV)
          <input
            type="file"
            accept=".xlsx,.csv,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet"
            className="mt-1 block text-sm"
            onChange={(e) => void choose(e.target.files?.[0] ?? null)}
          />
        </label>

        {headers.length > 0 && (
          <section aria-labelledby="mapping-heading" className="space-y-3">
            <h2 id="mapping-heading" className="text-lg font-semibold text-ink-900">
              Match the columns
            </h2>
            <div className="grid gap-3 sm:grid-cols-2">
              {importFields.map((field) => (
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
                const result = await send("/technicians/import/preview", previewSchema);
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
              pending={pending}
              pendingLabel="Importing…"
              onClick={async () => {
                const result = await send("/technicians/import", reportSchema);
                if (result) {
                  setReport(result);
                  void queryClient.invalidateQueries();
                }
              }}
            >
              Import {preview.goodCount} {preview.goodCount === 1 ? "technician" : "technicians"}
            </Button>
          </section>
        )}

        {report && (
          <section aria-labelledby="report-heading" className="space-y-2" role="status">
            <h2 id="report-heading" className="text-lg font-semibold text-ink-900">
              Import report
            </h2>
            <p className="text-sm text-ink-800">
              Imported {report.imported}, invited {report.invited} by e-mail, left out {report.skipped.length}
              .
            </p>
            <Link to={paths.provider.technicians} className={buttonStyles("secondary")}>
              Back to technicians
            </Link>
          </section>
        )}
      </div>
    </>
  );
}
