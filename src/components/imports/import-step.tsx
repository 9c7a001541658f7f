import type { ReactNode } from "react";
import { env } from "@/config/env.ts";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { PageHeader } from "@/components/ui/page-header.tsx";

const XLSX_OR_CSV = ".xlsx,.csv,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";

/** The file an import reads: an Excel workbook or a CSV, told apart by the server from its bytes. */
export function SpreadsheetFileInput({ onChoose }: { onChoose: (file: File | null) => void }) {
  return (
    <label className="block text-sm font-medium text-ink-900">
      Spreadsheet (.xlsx or CSV)
      <input
        type="file"
        accept={XLSX_OR_CSV}
        className="mt-1 block w-full max-w-full text-sm"
        onChange={(e) => onChoose(e.target.files?.[0] ?? null)}
      />
    </label>
  );
}

/** One step of an import (matching, preview, report), titled so a screen reader can jump between them. */
export function ImportStep({
  id,
  title,
  status = false,
  className = "space-y-3",
  children,
}: {
  id: string;
  title: string;
  status?: boolean;
  className?: string;
  children: ReactNode;
}) {
  return (
    <section aria-labelledby={`${id}-heading`} className={className} role={status ? "status" : undefined}>
      <h2 id={`${id}-heading`} className="text-lg font-semibold text-ink-900">
        {title}
      </h2>
      {children}
    </section>
  );
}

/** An import page's title, with the template the server serves (its columns are the ones the import reads). */
export function ImportPageHeader({
  title,
  description,
  templatePath,
}: {
  title: string;
  description: string;
  templatePath: string;
}) {
  return (
    <PageHeader
      title={title}
      description={description}
      actions={
        <a href={`${env.VITE_API_BASE}${templatePath}`} className={buttonStyles("secondary")} download>
          Download template
        </a>
      }
    />
  );
}
