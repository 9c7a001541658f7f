import { access, mkdtemp, rm, writeFile } from "node:fs/promises";
import { constants } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { DocumentUnreadableError } from "./document-unreadable-error.ts";
import { ChildFailedError, MAX_OCR_PIXELS, pdfPageSizes, renderDpi, runBounded } from "./render-bounds.ts";

export interface OcrOptions {
  timeoutMs?: number;
  tesseractPath?: string;
  pdftoppmPath?: string;
}
export interface PdfOcrOptions extends OcrOptions {
  /** Certificates and cards carry what we read on the first pages. */
  maxPages?: number;
  dpi?: number;
}

const TESSERACT = "/usr/bin/tesseract";
const PDFTOPPM = "/usr/bin/pdftoppm";
const DEFAULT_TIMEOUT_MS = 30_000;
const DEFAULT_OCR_PAGES = 2;
// 200 dpi keeps 7-point certificate print legible to tesseract at about 2 s a page.
const DEFAULT_DPI = 200;
// Layout analysis by columns (psm 4) keeps each coverage row on one line; kept spaces mark the gaps between boxes.
const TESSERACT_ARGS = ["--psm", "4", "-c", "preserve_interword_spaces=1"];
// One thread per page: tesseract's OpenMP threads cost more than they save on small pages and cannot be timed out cleanly.
const CHILD_ENV = { OMP_THREAD_LIMIT: "1", PATH: "/usr/bin:/bin" };
const MAX_OUTPUT_BYTES = 4 * 1024 * 1024;

async function isExecutable(path: string): Promise<boolean> {
  return access(path, constants.X_OK).then(
    () => true,
    () => false,
  );
}

/** True when tesseract (and pdftoppm, for scanned PDFs) can run on this machine. */
export async function isOcrAvailable(options: OcrOptions = {}): Promise<boolean> {
  const [ocr, render] = await Promise.all([
    isExecutable(options.tesseractPath ?? TESSERACT),
    isExecutable(options.pdftoppmPath ?? PDFTOPPM),
  ]);
  return ocr && render;
}

/** A poppler or tesseract child, through the shared queue and under the memory cap (render-bounds.ts). */
async function run(file: string, args: string[], timeoutMs: number): Promise<string> {
  if (timeoutMs <= 0) throw new DocumentUnreadableError("timeout");
  return runBounded(file, args, { timeoutMs, env: CHILD_ENV, maxBuffer: MAX_OUTPUT_BYTES }).catch(
    (err: unknown) => {
      if (err instanceof ChildFailedError) {
        throw err.timedOut
          ? new DocumentUnreadableError("timeout")
          : new DocumentUnreadableError("corrupt", err.message);
      }
      throw err;
    },
  );
}

async function withTempDir<T>(work: (dir: string) => Promise<T>): Promise<T> {
  const dir = await mkdtemp(join(tmpdir(), "clearbench-ocr-"));
  try {
    return await work(dir);
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

/** Text read from an image file (a path) or image bytes by tesseract, within the time limit. */
export async function ocrImage(input: string | Uint8Array, options: OcrOptions = {}): Promise<string> {
  const timeoutMs = options.timeoutMs ?? DEFAULT_TIMEOUT_MS;
  const tesseract = options.tesseractPath ?? TESSERACT;
  if (typeof input === "string") return run(tesseract, [input, "stdout", ...TESSERACT_ARGS], timeoutMs);
  if (input.byteLength === 0) throw new DocumentUnreadableError("empty");
  return withTempDir(async (dir) => {
    const path = join(dir, "image");
    await writeFile(path, input);
    return run(tesseract, [path, "stdout", ...TESSERACT_ARGS], timeoutMs);
  });
}

/**
 * Text of a scanned PDF: its first pages rendered by pdftoppm one at a time, each at a resolution chosen from its size
 * so no render exceeds MAX_OCR_PIXELS, then read by tesseract, all within one time limit.
 */
export async function ocrPdf(bytes: Uint8Array, options: PdfOcrOptions = {}): Promise<string> {
  if (bytes.byteLength === 0) throw new DocumentUnreadableError("empty");
  const deadline = Date.now() + (options.timeoutMs ?? DEFAULT_TIMEOUT_MS);
  const pages = options.maxPages ?? DEFAULT_OCR_PAGES;
  return withTempDir(async (dir) => {
    const pdfPath = join(dir, "document.pdf");
    await writeFile(pdfPath, bytes);
    const sizes = await pdfPageSizes(pdfPath, 1, pages, Math.max(1, deadline - Date.now()));
    if (sizes.length === 0) throw new DocumentUnreadableError("corrupt", "no page sizes");
    const texts: string[] = [];
    for (const size of sizes) {
      const dpi = renderDpi(size, options.dpi ?? DEFAULT_DPI, MAX_OCR_PIXELS);
      const out = join(dir, `page-${size.page}`);
      const renderArgs = [
        "-r",
        String(dpi),
        "-f",
        String(size.page),
        "-l",
        String(size.page),
        "-singlefile",
        "-png",
        pdfPath,
        out,
      ];
      await run(options.pdftoppmPath ?? PDFTOPPM, renderArgs, deadline - Date.now());
      const image = `${out}.png`;
      if (!(await isReadable(image))) throw new DocumentUnreadableError("corrupt", "page did not render");
      texts.push(await ocrImage(image, { ...options, timeoutMs: deadline - Date.now() }));
    }
    return texts.join("\n");
  });
}

async function isReadable(path: string): Promise<boolean> {
  return access(path, constants.R_OK).then(
    () => true,
    () => false,
  );
}
