import { useState } from "react";
import Papa from "papaparse";

/** A zip's local file header (PKWARE APPNOTE §4.3.7): an .xlsx workbook, whose header row only the server can read. */
async function isZip(file: File) {
  const head = new Uint8Array(await file.slice(0, 4).arrayBuffer());
  return head[0] === 0x50 && head[1] === 0x4b && head[2] === 0x03 && head[3] === 0x04;
}

async function csvHeaderRow(file: File) {
  // Only the header row is read here, to offer the columns; the server reads and checks the whole file.
  const firstLine = (await file.slice(0, 64 * 1024).text()).replace(/^\uFEFF/, "");
  return (Papa.parse<string[]>(firstLine, { preview: 1 }).data[0] ?? []).filter((h) => h.trim() !== "");
}

/** What every import preview answers besides its rows: the file's headers and the mapping the server used. */
export interface PreviewWithMapping<M> {
  headers: string[];
  mapping: M;
}

/**
 * The state an import page walks through: a file, its columns matched to fields, a preview, a report. A CSV's header
 * row is read here; a workbook's is not, so it is previewed at once with no mapping (the server guesses from its
 * headers) and the headers and mapping come back with the preview.
 */
export function useSpreadsheetImport<M, P extends PreviewWithMapping<M>, R>(guess: (headers: string[]) => M) {
  const [file, setFile] = useState<File | null>(null);
  const [headers, setHeaders] = useState<string[]>([]);
  const [mapping, setMappingState] = useState<M | null>(null);
  const [preview, setPreview] = useState<P | null>(null);
  const [report, setReport] = useState<R | null>(null);
  const [error, setError] = useState<unknown>(null);
  const [pending, setPending] = useState(false);

  async function run<T>(send: (file: File, mapping: M | null) => Promise<T>, chosen = file, used = mapping) {
    if (!chosen) return undefined;
    setPending(true);
    setError(null);
    try {
      return await send(chosen, used);
    } catch (err) {
      setError(err);
      return undefined;
    } finally {
      setPending(false);
    }
  }

  async function choose(chosen: File | null, previewOf: (file: File, mapping: M | null) => Promise<P>) {
    setFile(chosen);
    setHeaders([]);
    setMappingState(null);
    setPreview(null);
    setReport(null);
    setError(null);
    if (!chosen) return;
    if (await isZip(chosen)) {
      const result = await run(previewOf, chosen, null);
      if (result) {
        setHeaders(result.headers);
        setMappingState(result.mapping);
        setPreview(result);
      }
      return;
    }
    const found = await csvHeaderRow(chosen);
    setHeaders(found);
    setMappingState(guess(found));
  }

  /** A changed mapping or option makes the preview stale: the rows must be checked again. */
  function setMapping(next: M) {
    setMappingState(next);
    setPreview(null);
  }

  return {
    file,
    headers,
    mapping,
    setMapping,
    preview,
    setPreview,
    report,
    setReport,
    error,
    pending,
    choose,
    run,
  };
}
