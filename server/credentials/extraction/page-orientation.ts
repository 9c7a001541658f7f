/**
 * Which way up a photographed page is, and how far it is tilted, measured from its pixels alone, so a photo taken
 * sideways, upside down or a few degrees off is turned once and read by tesseract once (orientation detection and a
 * reading at each wrong turn each cost as much as the reading that counts).
 *
 * Lines of print make dark stripes: projected across the lines, at the angle they run, the ink piles up in sharp
 * peaks, and at any other angle it smears out. The angle with the sharpest peaks gives the turn modulo a half turn
 * and the tilt. Which side is up comes from the shape of each stripe: capitals, digits and ascenders reach well above
 * the band of small letters, descenders only a little below it, so an upright line's ink sits low in its stripe.
 */

import { localMeans, type GreyPixels } from "./grey-pixels.ts";

export interface PageOrientation {
  /** Counter-clockwise degrees that make the page upright and level, in (-180, 180]. */
  degrees: number;
  /** False when the lines or their up side were not plain enough to act on; the reading then decides. */
  sure: boolean;
}

// Analysed at about this many pixels on the long side: lines of 7-point print at 200 dpi stay a few pixels apart.
const ANALYSIS_LONG_SIDE = 1100;
// A pixel is ink when it is this much darker than the mean of its neighbourhood (uneven light, grey paper).
const INK_CONTRAST = 0.78;
const WINDOW = 12;
// Photos of documents are held within about this of a quarter turn; above it the page is not a photo of a page.
const MAX_TILT = 15;
// The lines' direction must beat the crosswise one by this much; a table of ruled boxes can come close.
const MIN_DIRECTION_RATIO = 1.25;
// The ink's mean must sit this far (a share of the stripe's height) off its middle, summed over lines, to tell up.
const MIN_UP_SKEW = 0.03;

interface Ink {
  xs: Float32Array;
  ys: Float32Array;
  count: number;
}

/** Ink pixels of a downscaled copy (darkest of each block, so thin strokes survive), centred on the page. */
function inkOf(image: GreyPixels): { ink: Ink; width: number; height: number } {
  const step = Math.max(1, Math.round(Math.max(image.width, image.height) / ANALYSIS_LONG_SIDE));
  const width = Math.floor(image.width / step);
  const height = Math.floor(image.height / step);
  const grey = new Float32Array(width * height);
  for (let y = 0; y < height; y += 1)
    for (let x = 0; x < width; x += 1) {
      let darkest = 255;
      for (let dy = 0; dy < step; dy += 1)
        for (let dx = 0; dx < step; dx += 1) {
          const value = image.grey[(y * step + dy) * image.width + x * step + dx]!;
          if (value < darkest) darkest = value;
        }
      grey[y * width + x] = darkest;
    }
  const means = localMeans(width, height, grey, WINDOW);
  const xs: number[] = [];
  const ys: number[] = [];
  for (let y = 0; y < height; y += 1) {
    for (let x = 0; x < width; x += 1) {
      const mean = means[y * width + x]!;
      const value = grey[y * width + x]!;
      if (value < mean * INK_CONTRAST && mean - value > 24) {
        xs.push(x - width / 2);
        ys.push(y - height / 2);
      }
    }
  }
  return { ink: { xs: Float32Array.from(xs), ys: Float32Array.from(ys), count: xs.length }, width, height };
}

/** The ink projected across lines running at `degrees` (counter-clockwise turn that levels them): one bin a pixel. */
function profile(ink: Ink, degrees: number, span: number): Float64Array {
  const angle = (degrees * Math.PI) / 180;
  const [cos, sin] = [Math.cos(angle), Math.sin(angle)];
  const bins = new Float64Array(2 * span + 1);
  for (let i = 0; i < ink.count; i += 1) {
    // Row of the pixel once the image is turned counter-clockwise by the angle (y grows downwards).
    const row = Math.round(-ink.xs[i]! * sin + ink.ys[i]! * cos) + span;
    if (row >= 0 && row < bins.length) bins[row] = bins[row]! + 1;
  }
  return bins;
}

/** How sharply the ink piles up in the profile: the mean count of ink sharing a pixel's bin, over the mean. */
function sharpness(bins: Float64Array, count: number): number {
  let squares = 0;
  let first = -1;
  let last = -1;
  for (let i = 0; i < bins.length; i += 1) {
    squares += bins[i]! * bins[i]!;
    if (bins[i]! > 0) {
      if (first < 0) first = i;
      last = i;
    }
  }
  return count && last > first ? (squares * (last - first + 1)) / (count * count) : 0;
}

function bestAngle(ink: Ink, span: number, around: number, reach: number, step: number) {
  let best = { degrees: around, score: -1 };
  for (let d = around - reach; d <= around + reach + 1e-9; d += step) {
    const score = sharpness(profile(ink, d, span), ink.count);
    if (score > best.score) best = { degrees: d, score };
  }
  return best;
}

/**
 * How far the ink of each line sits below its stripe's middle, as a share of the stripe's height, weighted by the
 * line's ink: above zero the page reads upright at this angle, below zero it is upside down.
 */
function lowInkSkew(bins: Float64Array): number {
  let peak = 0;
  for (const value of bins) peak = Math.max(peak, value);
  const floor = peak * 0.04;
  let weighted = 0;
  let mass = 0;
  let i = 0;
  while (i < bins.length) {
    if (bins[i]! <= floor) {
      i += 1;
      continue;
    }
    const start = i;
    let sum = 0;
    let moment = 0;
    while (i < bins.length && bins[i]! > floor) {
      sum += bins[i]!;
      moment += bins[i]! * i;
      i += 1;
    }
    const end = i - 1;
    // A stripe of one or two pixels is a rule or a speck, not a line of print.
    if (end - start < 3) continue;
    const offset = (moment / sum - (start + end) / 2) / (end - start + 1);
    weighted += offset * sum;
    mass += sum;
  }
  return mass ? weighted / mass : 0;
}

const normalised = (degrees: number) => {
  const d = ((degrees % 360) + 360) % 360;
  return d > 180 ? d - 360 : d;
};

/** The counter-clockwise turn that makes a photographed page upright and level (see the top of this file). */
export function pageOrientation(image: GreyPixels): PageOrientation {
  const { ink, width, height } = inkOf(image);
  if (ink.count < 500) return { degrees: 0, sure: false };
  const span = Math.ceil(Math.hypot(width, height) / 2) + 1;
  // Coarse over both directions, then fine around the better one.
  const across = bestAngle(ink, span, 0, MAX_TILT, 1);
  const down = bestAngle(ink, span, 90, MAX_TILT, 1);
  const [better, worse] = across.score >= down.score ? [across, down] : [down, across];
  const fine = bestAngle(ink, span, better.degrees, 1, 0.1);
  const skew = lowInkSkew(profile(ink, fine.degrees, span));
  const degrees = normalised(skew >= 0 ? fine.degrees : fine.degrees + 180);
  const sure = better.score >= MIN_DIRECTION_RATIO * worse.score && Math.abs(skew) >= MIN_UP_SKEW;
  return { degrees: Math.round(degrees * 10) / 10, sure };
}
