import { createRequire } from "node:module";
import { Worker } from "node:worker_threads";
import { DocumentUnreadableError } from "./document-unreadable-error.ts";
import { layoutText, type PositionedText } from "../../../shared/credentials/locate-values.ts";

export { DocumentUnreadableError, type UnreadableReason } from "./document-unreadable-error.ts";

export interface PdfTextOptions {
  /** Wall-clock limit; the worker reading the PDF is terminated when it passes. */
  timeoutMs?: number;
  /** Pages read; a certificate or card has one or two, so a long file is cut short rather than read whole. */
  maxPages?: number;
}
export interface PdfText {
  text: string;
  pageCount: number;
  pagesRead: number;
  /** Each text item with its box, as fractions of its page (top-left origin), for showing where a value was read. */
  items: PositionedText[];
}

const DEFAULT_TIMEOUT_MS = 10_000;
const DEFAULT_MAX_PAGES = 10;
// pdf.js can be made to allocate without bound by a hostile file; the worker's heap is capped so only it dies.
const WORKER_HEAP_MB = 256;

const pdfParsePath = createRequire(import.meta.url).resolve("pdf-parse");

// The worker runs plain JavaScript (eval) so it needs no TypeScript loader in any runtime (tsx, Vitest).
// It stays up between documents (starting a thread and loading pdf.js cost more than reading a one-page card) and
// reads one document at a time; it is replaced after a time-out or a crash.
const WORKER_SOURCE = `
const { parentPort, workerData } = require("node:worker_threads");
const { PDFParse } = require(workerData.modulePath);
parentPort.on("message", async (job) => {
  const parser = new PDFParse({ data: job.bytes });
  try {
    const result = await parser.getText({ first: job.maxPages, pageJoiner: "" });
    // The same pages' items with their positions (pdf.js transform: e, f are the baseline origin in points).
    const doc = await parser.load();
    const items = [];
    for (let number = 1; number <= result.pages.length; number += 1) {
      const page = await doc.getPage(number);
      const { width, height } = page.getViewport({ scale: 1 });
      const content = await page.getTextContent();
      for (const item of content.items) {
        if (!item.str || !item.str.trim()) continue;
        const [a, b, , , e, f] = item.transform;
        const size = Math.hypot(a, b) || item.height || 1;
        items.push({
          page: number,
          text: item.str,
          x: e / width,
          y: (height - f - size) / height,
          w: (item.width || size * item.str.length * 0.5) / width,
          h: (size * 1.2) / height,
          em: size / width,
        });
        if (items.length > 20000) break;
      }
    }
    parentPort.postMessage({ ok: true, text: result.text, pageCount: result.total, pagesRead: result.pages.length, items });
  } catch (err) {
    parentPort.postMessage({ ok: false, name: String(err && err.name), message: String(err && err.message) });
  } finally {
    await parser.destroy().catch(() => undefined);
  }
});
`;

type WorkerReply =
  | { ok: true; text: string; pageCount: number; pagesRead: number; items: PositionedText[] }
  | { ok: false; name: string; message: string };

function toUnreadable(reply: Extract<WorkerReply, { ok: false }>): DocumentUnreadableError {
  if (reply.name === "PasswordException") return new DocumentUnreadableError("encrypted");
  return new DocumentUnreadableError("corrupt", reply.message);
}

let reader: Worker | undefined;
// Documents wait their turn for the one reader, so a time limit covers one document's reading, not a queue's.
let turn: Promise<unknown> = Promise.resolve();

function startReader(): Worker {
  const worker = new Worker(WORKER_SOURCE, {
    eval: true,
    workerData: { modulePath: pdfParsePath },
    resourceLimits: { maxOldGenerationSizeMb: WORKER_HEAP_MB },
    stdout: true,
    stderr: true,
  });
  // An idle reader must not keep a job or a test run alive.
  worker.unref();
  worker.once("exit", () => {
    if (reader === worker) reader = undefined;
  });
  return worker;
}

function readInWorker(bytes: Uint8Array, maxPages: number, timeoutMs: number): Promise<WorkerReply> {
  const worker = (reader ??= startReader());
  let timer: NodeJS.Timeout | undefined;
  let onExit: ((code: number) => void) | undefined;
  let onError: ((err: Error) => void) | undefined;
  return new Promise<WorkerReply>((resolve, reject) => {
    timer = setTimeout(() => {
      // A reader stuck on a hostile file is stopped; the next document gets a fresh one.
      reader = undefined;
      void worker.terminate();
      reject(new DocumentUnreadableError("timeout"));
    }, timeoutMs);
    onExit = (code) => reject(new DocumentUnreadableError("corrupt", `reader stopped (${code})`));
    onError = (err) => {
      reader = undefined;
      void worker.terminate();
      reject(new DocumentUnreadableError("corrupt", err.message));
    };
    worker.once("message", resolve);
    worker.once("exit", onExit);
    worker.once("error", onError);
    worker.postMessage({ bytes: new Uint8Array(bytes), maxPages });
  }).finally(() => {
    clearTimeout(timer);
    worker.removeAllListeners("message");
    if (onExit) worker.off("exit", onExit);
    if (onError) worker.off("error", onError);
  });
}

/** The text layer of a PDF, read in a worker thread that is killed at the time limit. */
export async function extractPdfText(bytes: Uint8Array, options: PdfTextOptions = {}): Promise<PdfText> {
  if (bytes.byteLength === 0) throw new DocumentUnreadableError("empty");
  if (!Buffer.from(bytes.subarray(0, 1024)).includes("%PDF-"))
    throw new DocumentUnreadableError("corrupt", "no PDF header");
  const timeoutMs = options.timeoutMs ?? DEFAULT_TIMEOUT_MS;
  const maxPages = options.maxPages ?? DEFAULT_MAX_PAGES;
  const mine = turn.then(() => readInWorker(bytes, maxPages, timeoutMs));
  turn = mine.catch(() => undefined);
  const reply = await mine;
  if (!reply.ok) throw toUnreadable(reply);
  // Lines and cells rebuilt from the items' positions; pdf.js's own text when a page gave no positioned items.
  const text = reply.items.length > 0 ? layoutText(reply.items) : reply.text;
  return { text, pageCount: reply.pageCount, pagesRead: reply.pagesRead, items: reply.items };
}
