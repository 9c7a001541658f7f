import { access, mkdtemp, rm, writeFile } from "node:fs/promises";
import { constants } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { loadJimp } from "../../http/jimp.ts";
import { imageDimensionsOfFile } from "./image-dimensions.ts";
import { pageOrientation } from "./page-orientation.ts";
import { edgeSteepness, greyOf, turnedGrey, unsharpGrey, type GreyPixels } from "./grey-pixels.ts";
import { layoutText, type PositionedText } from "../../../shared/credentials/locate-values.ts";
import {
  readingQuality,
  readsUpright,
  skewDegrees,
  tsvToPositionedText,
  uprightTurn,
} from "../../../shared/credentials/ocr-layout.ts";
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
// Sauvola's local threshold keeps text legible under uneven light (a lamp, a shadow), where one global threshold turns
// a shaded, tilted photo all black or all white.
const TESSERACT_ARGS = ["--psm", "4", "-c", "preserve_interword_spaces=1", "-c", "thresholding_method=2"];
// Orientation and script detection only: answers which quarter turn makes the page upright.
const OSD_ARGS = ["--psm", "0", "-c", "thresholding_method=2"];
// A tilt under this reads fine; over the upper bound it is not a tilted photo but something the turn step missed.
const MIN_DESKEW_DEGREES = 0.8;
const MAX_DESKEW_DEGREES = 15;
// Up to this tilt tesseract reads the words as well as on a levelled image, so its word boxes are levelled instead of
// the image being turned and read a second time (a second reading was half the time of a tilted photo). Above it the
// tilted reading misreads small print: a card tilted 2.5 degrees read "06/28: 2025" until turned level and re-read.
const MAX_BOX_LEVEL_DEGREES = 2;
// A measured turn that reads this few sure words may be wrong rather than blurred: orientation detection is asked.
const MIN_MEASURED_QUALITY = 12;
// Edge steepness (grey-pixels.ts) under which a photo's print is sharpened, gently, and under which it is blurred
// enough to be sharpened hard: crisp photos measure 1.5 and more, ones softened by a pixel 0.4 to 0.6, by two 0.15 to 0.35.
const SOFT_PRINT_STEEPNESS = 1;
const BLURRED_PRINT_STEEPNESS = 0.37;
// On a blurred photo, even sharpened, ink spreads into grey that Sauvola's default k (0.34) drops as paper, breaking
// thin strokes; a lower k keeps more of it as ink. Crisp and softened pages keep the default, which reads them best.
const BLURRED_PRINT_SAUVOLA_K = 0.2;
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

export interface OcrReading {
  text: string;
  /** Tesseract's word boxes as fractions of the (upright, levelled) page, for the layout reader and evidence boxes. */
  items: PositionedText[];
}

/** The page image decoded (Jimp) to grey, after its declared size is checked against the pixel cap. */
async function decoded(path: string) {
  // Checked from the header before decoding: the decode itself runs in this process, outside the children's caps.
  const declared = await imageDimensionsOfFile(path);
  if (!declared || declared.width * declared.height > MAX_OCR_PIXELS)
    throw new DocumentUnreadableError("corrupt", "image too large to read");
  const image = await (await loadJimp()).read(path);
  if (image.bitmap.width * image.bitmap.height > MAX_OCR_PIXELS)
    throw new DocumentUnreadableError("corrupt", "image too large to read");
  return greyOf(image.bitmap);
}

/**
 * Writes the grey image turned counter-clockwise by `degrees` (white corners), sharpened when asked, as a PGM, and
 * returns its path: tesseract reads grey anyway, and a PGM is written in milliseconds where a PNG takes far longer.
 */
async function writeTurned(
  image: GreyPixels,
  degrees: number,
  sharpen: Sharpening | undefined,
  out: string,
): Promise<string> {
  let pixels = degrees ? turnedGrey(image, degrees) : image;
  if (sharpen) pixels = unsharpGrey(pixels, sharpen.amount, sharpen.radius);
  const header = Buffer.from(`P5\n${pixels.width} ${pixels.height}\n255\n`, "ascii");
  await writeFile(out, Buffer.concat([header, pixels.grey]));
  return out;
}

// Unsharp-mask amount and radius (pixels) for softened print, and for print blurred by two pixels or more: chosen on
// the extraction corpus's tune part.
const GENTLE_SHARPENING = { amount: 1, radius: 2 } as const;
const HARD_SHARPENING = { amount: 1.5, radius: 3 } as const;

interface Sharpening {
  amount: number;
  radius: number;
  /** Sauvola's k for this page when it differs from tesseract's own (0.34). */
  thresholdK?: number;
}

/** How much a photo's print is sharpened before it is read, from how soft it is (grey-pixels.ts). */
export function sharpeningFor(image: GreyPixels): Sharpening | undefined {
  const steepness = edgeSteepness(image);
  if (steepness >= SOFT_PRINT_STEEPNESS) return undefined;
  if (steepness < BLURRED_PRINT_STEEPNESS) return { ...HARD_SHARPENING, thresholdK: BLURRED_PRINT_SAUVOLA_K };
  return GENTLE_SHARPENING;
}

/**
 * One page image read with positions. A photo is measured first (page-orientation.ts): turned upright and, when tilted
 * more than tesseract reads well, levelled in the same turn, so it is read in full once. A scan is read as it came
 * first, since scans arrive upright; one that does not read upright is measured and turned the same way. A doubtful
 * measure is checked against the half turn; orientation detection (`--psm 0`) is the last resort, for a page whose
 * lines the measure could not find. Every tesseract run goes through the bounded queue.
 */
async function readPageImage(
  imagePath: string,
  page: number,
  dir: string,
  deadline: number,
  tesseract: string,
  measureFirst: boolean,
): Promise<OcrReading> {
  let image: GreyPixels | undefined;
  // Photos only: a scan's print is as sharp as the scanner made it.
  const sharpen = measureFirst ? sharpeningFor((image = await decoded(imagePath))) : undefined;
  const read = async (degrees: number) => {
    const path =
      degrees === 0 && !sharpen
        ? imagePath
        : await writeTurned(
            (image ??= await decoded(imagePath)),
            degrees,
            sharpen,
            join(dir, `turn-${page}.pgm`),
          );
    const threshold = sharpen?.thresholdK ? ["-c", `thresholding_kfactor=${sharpen.thresholdK}`] : [];
    const tsv = await run(
      tesseract,
      [path, "stdout", ...TESSERACT_ARGS, ...threshold, "tsv"],
      deadline - Date.now(),
    );
    return { degrees, tsv, quality: readingQuality(tsv), upright: readsUpright(tsv) };
  };
  /** The measured turn, with a tilt tesseract reads well left to the word boxes (levelled below). */
  const measuredTurn = async () => {
    const measure = pageOrientation((image ??= await decoded(imagePath)));
    const quarter = Math.round(measure.degrees / 90) * 90;
    const degrees = Math.abs(measure.degrees - quarter) <= MAX_BOX_LEVEL_DEGREES ? quarter : measure.degrees;
    return { degrees: ((degrees % 360) + 360) % 360, sure: measure.sure };
  };
  let best: Awaited<ReturnType<typeof read>> | undefined;
  let measure: Awaited<ReturnType<typeof measuredTurn>> | undefined;
  if (!measureFirst) best = await read(0);
  if (!best?.upright) {
    measure = await measuredTurn();
    if (!best || measure.degrees !== 0) {
      const turned = await read(measure.degrees);
      if (!best || turned.quality > best.quality) best = turned;
    }
  }
  if (!best.upright && measure && !measure.sure) {
    const other = await read((measure.degrees + 180) % 360);
    if (other.quality > best.quality) best = other;
  }
  if (!best.upright && measure && best.quality < MIN_MEASURED_QUALITY) {
    // The measure found no lines to go on: orientation detection suggests a quarter turn, the others are tried after.
    const osd = await run(tesseract, [imagePath, "stdout", ...OSD_ARGS], deadline - Date.now()).catch(
      (err: unknown) => {
        if (err instanceof DocumentUnreadableError && err.reason === "timeout") throw err;
        return "";
      },
    );
    const tried = new Set<number>([best.degrees, 0, measure.degrees, (measure.degrees + 180) % 360]);
    for (const turn of [uprightTurn(osd), 180, 90, 270] as const) {
      if (best.upright) break;
      // Tesseract names the clockwise turn; Jimp turns counter-clockwise.
      const degrees = (360 - turn) % 360;
      if (tried.has(degrees)) continue;
      tried.add(degrees);
      const other = await read(degrees);
      if (other.quality > best.quality) best = other;
    }
  }
  let { tsv } = best;
  const skew = skewDegrees(tsv);
  const tilt = Math.abs(skew);
  let levelDegrees = 0;
  if (tilt >= MIN_DESKEW_DEGREES && tilt <= MAX_BOX_LEVEL_DEGREES) levelDegrees = skew;
  else if (tilt >= MIN_DESKEW_DEGREES && tilt <= MAX_DESKEW_DEGREES) {
    // Lines falling to the right (clockwise tilt) are levelled by turning counter-clockwise by the same angle.
    tsv = (await read((best.degrees + skew + 360) % 360)).tsv;
  }
  const items = tsvToPositionedText(tsv, page, levelDegrees);
  return { text: layoutText(items), items };
}

/** Text and word boxes read from an image file (a path) or image bytes by tesseract, within the time limit. */
export async function ocrImageLayout(
  input: string | Uint8Array,
  options: OcrOptions = {},
): Promise<OcrReading> {
  const deadline = Date.now() + (options.timeoutMs ?? DEFAULT_TIMEOUT_MS);
  const tesseract = options.tesseractPath ?? TESSERACT;
  if (typeof input !== "string" && input.byteLength === 0) throw new DocumentUnreadableError("empty");
  return withTempDir(async (dir) => {
    let path = input;
    if (typeof path !== "string") {
      path = join(dir, "image");
      await writeFile(path, input);
    }
    return readPageImage(path, 1, dir, deadline, tesseract, true);
  });
}

/** Text read from an image file (a path) or image bytes by tesseract, within the time limit. */
export async function ocrImage(input: string | Uint8Array, options: OcrOptions = {}): Promise<string> {
  return (await ocrImageLayout(input, options)).text;
}

/**
 * Text and word boxes of a scanned PDF: its first pages rendered by pdftoppm one at a time, each at a resolution
 * chosen from its size so no render exceeds MAX_OCR_PIXELS, then read by tesseract, all within one time limit.
 */
export async function ocrPdfLayout(bytes: Uint8Array, options: PdfOcrOptions = {}): Promise<OcrReading> {
  if (bytes.byteLength === 0) throw new DocumentUnreadableError("empty");
  const deadline = Date.now() + (options.timeoutMs ?? DEFAULT_TIMEOUT_MS);
  const pages = options.maxPages ?? DEFAULT_OCR_PAGES;
  return withTempDir(async (dir) => {
    const pdfPath = join(dir, "document.pdf");
    await writeFile(pdfPath, bytes);
    const sizes = await pdfPageSizes(pdfPath, 1, pages, Math.max(1, deadline - Date.now()));
    if (sizes.length === 0) throw new DocumentUnreadableError("corrupt", "no page sizes");
    const items: PositionedText[] = [];
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
      const page = await readPageImage(
        image,
        size.page,
        dir,
        deadline,
        options.tesseractPath ?? TESSERACT,
        false,
      );
      items.push(...page.items);
    }
    return { text: layoutText(items), items };
  });
}

/** Text of a scanned PDF (see ocrPdfLayout). */
export async function ocrPdf(bytes: Uint8Array, options: PdfOcrOptions = {}): Promise<string> {
  return (await ocrPdfLayout(bytes, options)).text;
}

async function isReadable(path: string): Promise<boolean> {
  return access(path, constants.R_OK).then(
    () => true,
    () => false,
  );
}
