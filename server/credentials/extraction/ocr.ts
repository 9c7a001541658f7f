import { execFile } from "node:child_process";
import { access, mkdtemp, readdir, rm, writeFile } from "node:fs/promises";
import { constants } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { DocumentUnreadableError } from "./document-unreadable-error.ts";

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

function run(file: string, args: string[], timeoutMs: number): Promise<string> {
  return new Promise((resolve, reject) => {
    execFile(
      file,
      args,
      {
        timeout: Math.max(1, timeoutMs),
        killSignal: "SIGKILL",
        env: CHILD_ENV,
        maxBuffer: MAX_OUTPUT_BYTES,
        encoding: "utf8",
      },
      (error, stdout) => {
        if (!error) return resolve(stdout);
        if (error.killed || error.signal === "SIGKILL") return reject(new DocumentUnreadableError("timeout"));
        reject(new DocumentUnreadableError("corrupt", `${file.split("/").pop()} failed`));
      },
    );
  });
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

/** Text of a scanned PDF: its first pages rendered by pdftoppm, then read by tesseract, all within one time limit. */
export async function ocrPdf(bytes: Uint8Array, options: PdfOcrOptions = {}): Promise<string> {
  if (bytes.byteLength === 0) throw new DocumentUnreadableError("empty");
  const deadline = Date.now() + (options.timeoutMs ?? DEFAULT_TIMEOUT_MS);
  const pages = String(options.maxPages ?? DEFAULT_OCR_PAGES);
  return withTempDir(async (dir) => {
    const pdfPath = join(dir, "document.pdf");
    await writeFile(pdfPath, bytes);
    const renderArgs = [
      "-r",
      String(options.dpi ?? DEFAULT_DPI),
      "-f",
      "1",
      "-l",
      pages,
      "-png",
      pdfPath,
      join(dir, "page"),
    ];
    await run(options.pdftoppmPath ?? PDFTOPPM, renderArgs, deadline - Date.now());
    const images = (await readdir(dir)).filter((name) => name.endsWith(".png")).sort();
    const texts: string[] = [];
    for (const image of images) {
      texts.push(await ocrImage(join(dir, image), { ...options, timeoutMs: deadline - Date.now() }));
    }
    return texts.join("\n");
  });
}
