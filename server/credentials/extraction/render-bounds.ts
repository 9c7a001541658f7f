import { execFile } from "node:child_process";
import { accessSync, constants } from "node:fs";
import { AppError } from "../../http/app-error.ts";
import { imageDimensionsOfFile } from "./image-dimensions.ts";

/**
 * Bounds on the poppler and tesseract children that render and read documents. A PDF of a kilobyte can declare a page
 * of any size, and the renderer allocates for what it declares, so every child is bounded three ways: pixels per
 * render (the resolution is chosen from the page's size), how many run at once (one small queue for the process), and
 * the memory each may map (prlimit, so the kernel refuses the allocation instead of the machine swapping).
 */

/** Largest page side accepted at upload: 50 in (3,600 pt), above any drawing sheet (ANSI E is 34 × 44 in, common practice). */
export const MAX_PAGE_SIDE_POINTS = 3_600;
/** Pixels of one preview render: a letter page at 110 dpi is about 1.2 million. */
export const MAX_PREVIEW_PIXELS = 8_000_000;
/** Pixels of one OCR render: a letter page at 200 dpi is about 3.7 million. */
export const MAX_OCR_PIXELS = 12_000_000;
/** Address space of one child; a 12-megapixel render needs well under 200 MB. */
export const CHILD_MEMORY_BYTES = 1024 * 1024 * 1024;
/** Children at once in this process: the machine's cores are shared with the database and the requests. */
export const MAX_CONCURRENT_CHILDREN = 2;
/** Jobs allowed to wait for a slot; more are refused with 503 rather than queued without end. */
export const MAX_WAITING_CHILDREN = 16;

const PRLIMIT = "/usr/bin/prlimit";
const hasPrlimit = (() => {
  try {
    accessSync(PRLIMIT, constants.X_OK);
    return true;
  } catch {
    return false;
  }
})();

export interface JobQueue {
  run<T>(work: () => Promise<T>): Promise<T>;
  readonly active: number;
  readonly waiting: number;
}

/** A counting semaphore with a bounded waiting line. */
export function createJobQueue(limit: number, maxWaiting: number): JobQueue {
  let active = 0;
  const line: (() => void)[] = [];
  return {
    get active() {
      return active;
    },
    get waiting() {
      return line.length;
    },
    async run<T>(work: () => Promise<T>): Promise<T> {
      if (active >= limit) {
        if (line.length >= maxWaiting) {
          throw new AppError(
            "unavailable",
            "Too many documents are being read right now; try again in a minute",
          );
        }
        await new Promise<void>((resolve) => line.push(resolve));
      } else {
        active += 1;
      }
      try {
        return await work();
      } finally {
        const next = line.shift();
        if (next) next();
        else active -= 1;
      }
    },
  };
}

/** The one queue every render and OCR child of this process goes through. */
export const renderQueue = createJobQueue(MAX_CONCURRENT_CHILDREN, MAX_WAITING_CHILDREN);

export interface BoundedRunOptions {
  timeoutMs: number;
  memoryBytes?: number;
  env?: NodeJS.ProcessEnv;
  maxBuffer?: number;
  encoding?: "utf8" | "buffer";
}

/** The command line that runs `file` under the memory cap (prlimit when the machine has it). */
export function boundedCommand(
  file: string,
  args: string[],
  memoryBytes = CHILD_MEMORY_BYTES,
): [string, string[]] {
  return hasPrlimit ? [PRLIMIT, [`--as=${memoryBytes}`, "--", file, ...args]] : [file, args];
}

export class ChildFailedError extends Error {
  constructor(
    message: string,
    readonly timedOut: boolean,
  ) {
    super(message);
  }
}

/** Runs a child in the queue, under the memory cap, killed at the time limit; resolves with its standard output. */
export function runBounded(file: string, args: string[], options: BoundedRunOptions): Promise<string> {
  const [command, commandArgs] = boundedCommand(file, args, options.memoryBytes);
  return renderQueue.run(
    () =>
      new Promise<string>((resolve, reject) => {
        execFile(
          command,
          commandArgs,
          {
            timeout: Math.max(1, options.timeoutMs),
            killSignal: "SIGKILL",
            env: options.env ?? { PATH: "/usr/bin:/bin" },
            maxBuffer: options.maxBuffer ?? 4 * 1024 * 1024,
            encoding: "utf8",
          },
          (error, stdout) => {
            if (!error) return resolve(stdout);
            const timedOut = Boolean(error.killed || error.signal === "SIGKILL");
            reject(new ChildFailedError(`${file.split("/").pop()} failed`, timedOut));
          },
        );
      }),
  );
}

export interface PageSize {
  page: number;
  widthPt: number;
  heightPt: number;
}

/** Page sizes as poppler will render them (pdfinfo), for pages `first` to `last`; an empty list when it cannot tell. */
export async function pdfPageSizes(
  pdfPath: string,
  first: number,
  last: number,
  timeoutMs = 10_000,
): Promise<PageSize[]> {
  const out = await runBounded("/usr/bin/pdfinfo", ["-f", String(first), "-l", String(last), pdfPath], {
    timeoutMs,
  }).catch(() => "");
  const sizes: PageSize[] = [];
  for (const match of out.matchAll(/^Page\s+(\d+)\s+size:\s+([\d.]+)\s+x\s+([\d.]+)\s+pts/gm)) {
    sizes.push({ page: Number(match[1]), widthPt: Number(match[2]), heightPt: Number(match[3]) });
  }
  return sizes;
}

/**
 * The resolution for a page: the one asked for, lowered so the render stays within `maxPixels` (at least 1 dpi, which
 * keeps even an absurd page stored before the upload check small).
 */
export function renderDpi(
  size: Pick<PageSize, "widthPt" | "heightPt">,
  wantedDpi: number,
  maxPixels: number,
): number {
  const squareInches = (size.widthPt / 72) * (size.heightPt / 72);
  if (!(squareInches > 0)) return wantedDpi;
  const fitting = Math.sqrt(maxPixels / squareInches);
  return Math.max(1, Math.min(wantedDpi, Math.floor(fitting)));
}

/** Refuses, at upload, a PDF with a page larger than any document this registry takes. */
export async function refuseOversizedPages(pdfPath: string, pagesChecked = 10): Promise<void> {
  const sizes = await pdfPageSizes(pdfPath, 1, pagesChecked);
  const tooLarge = sizes.find((s) => Math.max(s.widthPt, s.heightPt) > MAX_PAGE_SIDE_POINTS);
  if (!tooLarge) return;
  const inches = (pt: number) => Math.round(pt / 72);
  const message = `Page ${tooLarge.page} is ${inches(tooLarge.widthPt)} × ${inches(tooLarge.heightPt)} in; pages up to ${MAX_PAGE_SIDE_POINTS / 72} in a side are accepted. Export or scan the document at its real size`;
  throw new AppError("invalid_input", message, [{ path: "file", message: "page too large" }]);
}

/** Pixels an uploaded photo or scan may declare: a 48-megapixel phone photo fits, a decompression bomb does not. */
export const MAX_UPLOAD_IMAGE_PIXELS = 50_000_000;

/** Refuses, at upload, a PNG or JPEG that declares more pixels than any photo of a card or certificate needs. */
export async function refuseOversizedImage(imagePath: string): Promise<void> {
  const declared = await imageDimensionsOfFile(imagePath);
  if (!declared || declared.width * declared.height <= MAX_UPLOAD_IMAGE_PIXELS) return;
  const megapixels = Math.round((declared.width * declared.height) / 1_000_000);
  const message = `The image is ${declared.width} × ${declared.height} pixels (${megapixels} megapixels); images up to ${MAX_UPLOAD_IMAGE_PIXELS / 1_000_000} megapixels are accepted. Send a smaller photo or scan`;
  throw new AppError("invalid_input", message, [{ path: "file", message: "image too large" }]);
}
