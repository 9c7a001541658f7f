import type { PositionedText } from "./locate-values.ts";

/** Quarter turns tesseract's orientation detection may ask for, clockwise, to make a page upright. */
export type QuarterTurn = 0 | 90 | 180 | 270;

// Orientation detection on a sparse card answers with low confidence (0.3 is common and usually right); only a zero
// means it had nothing to go on. A doubtful turn is checked afterwards by how well the page reads (readingQuality).
const MIN_OSD_CONFIDENCE = 0.05;

/**
 * The clockwise turn that makes a page upright, from `tesseract --psm 0` output ("Rotate: 90",
 * "Orientation confidence: 7.3"); 0 when the answer is missing or too unsure to act on.
 */
export function uprightTurn(osdOutput: string): QuarterTurn {
  const rotate = /Rotate:\s*(\d+)/.exec(osdOutput);
  const confidence = /Orientation confidence:\s*([\d.]+)/.exec(osdOutput);
  if (!rotate || !confidence || Number(confidence[1]) < MIN_OSD_CONFIDENCE) return 0;
  const turn = Number(rotate[1]) % 360;
  return turn === 90 || turn === 180 || turn === 270 ? turn : 0;
}

interface TsvWord {
  key: string;
  left: number;
  top: number;
  width: number;
  height: number;
  text: string;
  conf: number;
}

function parseTsv(tsv: string): { words: TsvWord[]; pageWidth: number; pageHeight: number } {
  const words: TsvWord[] = [];
  let pageWidth = 0;
  let pageHeight = 0;
  for (const row of tsv.split("\n")) {
    const cells = row.split("\t");
    if (cells.length < 12 || !/^\d+$/.test(cells[0]!)) continue;
    const [level, , block, par, lineNo, , left, top, width, height, conf] = cells.map(Number) as number[];
    if (level === 1) {
      pageWidth = width!;
      pageHeight = height!;
    }
    const text = cells.slice(11).join("\t").trim();
    // Level 5 rows are words; conf -1 marks a layout row with no text of its own.
    if (level !== 5 || !text || conf! < 0) continue;
    words.push({
      key: `${block}/${par}/${lineNo}`,
      left: left!,
      top: top!,
      width: width!,
      height: height!,
      text,
      conf: conf!,
    });
  }
  return { words, pageWidth, pageHeight };
}

/**
 * Tesseract's word boxes (`tesseract IMAGE stdout tsv`) as positioned text for the same layout reader as a PDF's
 * text items. Words tesseract put on one line share that line's top and height, so a tall capital beside a short
 * word never splits a line in two; sizes are fractions of the image, like the PDF path's fractions of the page.
 */
export function tsvToPositionedText(tsv: string, page: number, levelDegrees = 0): PositionedText[] {
  const parsed = parseTsv(tsv);
  const { pageWidth, pageHeight } = parsed;
  if (!pageWidth || !pageHeight) return [];
  const words = joinedAtHyphens(
    levelDegrees ? levelled(parsed.words, levelDegrees, pageWidth, pageHeight) : parsed.words,
  );
  const lines = new Map<string, { top: number; bottom: number }>();
  for (const word of words) {
    const line = lines.get(word.key);
    lines.set(word.key, {
      top: Math.min(line?.top ?? Infinity, word.top),
      bottom: Math.max(line?.bottom ?? 0, word.top + word.height),
    });
  }
  return words.map((word) => {
    const line = lines.get(word.key)!;
    const lineHeight = line.bottom - line.top;
    return {
      page,
      text: word.text,
      x: word.left / pageWidth,
      y: line.top / pageHeight,
      w: word.width / pageWidth,
      h: lineHeight / pageHeight,
      // A line box spans ascenders to descenders, about 1.2 font sizes (the PDF path uses the same ratio).
      em: lineHeight / 1.2 / pageWidth,
    };
  });
}

// Tesseract often splits a hyphenated number at its hyphen ("WC-" "956167") though the print has no space there; a
// gap under half the letters' height is that kerning, not a space a person would read.
const HYPHEN_JOIN_GAP = 0.5;

/** Neighbouring words of one line that meet at a hyphen, joined back into the one word printed. */
function joinedAtHyphens(words: TsvWord[]): TsvWord[] {
  const out: TsvWord[] = [];
  for (const word of words) {
    const last = out[out.length - 1];
    const meets =
      last &&
      last.key === word.key &&
      ((/[A-Za-z0-9]-$/.test(last.text) && /^[A-Za-z0-9]/.test(word.text)) ||
        (/[A-Za-z0-9]$/.test(last.text) && /^-[A-Za-z0-9]/.test(word.text)));
    const gap = last ? word.left - (last.left + last.width) : Infinity;
    if (last && meets && gap < HYPHEN_JOIN_GAP * Math.max(last.height, word.height)) {
      const right = Math.max(last.left + last.width, word.left + word.width);
      const top = Math.min(last.top, word.top);
      const bottom = Math.max(last.top + last.height, word.top + word.height);
      out[out.length - 1] = {
        ...last,
        text: last.text + word.text,
        width: right - last.left,
        top,
        height: bottom - top,
        conf: Math.min(last.conf, word.conf),
      };
    } else out.push(word);
  }
  return out;
}

/**
 * Word boxes of a page tilted by `degrees` (as skewDegrees measures it) moved to where they would be on the page turned
 * level about its centre: tesseract finds the lines of a page tilted a few degrees by itself, so levelling its boxes
 * puts each line's words at one height, as reading a levelled image again would, without that second reading.
 */
function levelled(words: TsvWord[], degrees: number, pageWidth: number, pageHeight: number): TsvWord[] {
  const angle = (degrees * Math.PI) / 180;
  const [cos, sin] = [Math.cos(angle), Math.sin(angle)];
  const [cx, cy] = [pageWidth / 2, pageHeight / 2];
  return words.map((word) => {
    const [dx, dy] = [word.left + word.width / 2 - cx, word.top + word.height / 2 - cy];
    const centreX = cx + dx * cos + dy * sin;
    const centreY = cy - dx * sin + dy * cos;
    return { ...word, left: centreX - word.width / 2, top: centreY - word.height / 2 };
  });
}

/**
 * The page's skew in degrees (positive: lines fall to the right, clockwise), the median slope of the baselines of
 * lines with at least three words; 0 when too few lines say so.
 */
export function skewDegrees(tsv: string): number {
  const { words } = parseTsv(tsv);
  const byLine = new Map<string, TsvWord[]>();
  for (const word of words) byLine.set(word.key, [...(byLine.get(word.key) ?? []), word]);
  const slopes: number[] = [];
  for (const line of byLine.values()) {
    if (line.length < 3) continue;
    const first = line[0]!;
    const last = line[line.length - 1]!;
    const run = last.left + last.width / 2 - (first.left + first.width / 2);
    if (run <= 0) continue;
    const rise = last.top + last.height - (first.top + first.height);
    slopes.push(Math.atan2(rise, run));
  }
  if (slopes.length < 2) return 0;
  slopes.sort((a, b) => a - b);
  return (slopes[Math.floor(slopes.length / 2)]! * 180) / Math.PI;
}

const isSureWord = (w: TsvWord) => w.conf >= 60 && hasTwoAlphanumerics(w.text);
const hasTwoAlphanumerics = (text: string) => (text.match(/[A-Za-z0-9]/g) ?? []).length >= 2;

/**
 * How well a page read: the words tesseract is fairly sure of (confidence 60 or more, two letters or digits at least).
 * An upside-down or sideways page reads as a few doubtful fragments, so the count tells a right turn from a wrong one.
 */
export function readingQuality(tsv: string): number {
  return parseTsv(tsv).words.filter(isSureWord).length;
}

// A sideways or upside-down page still yields a dozen "sure" fragments among a hundred guesses (12 of 93 on a blurred
// certificate photographed sideways), while an upright one is mostly sure words (74 of 84 on the same photo turned
// right); so uprightness is judged by the share of sure words, the count only guarding against near-empty pages.
const MIN_SURE_WORDS = 12;
const MIN_SURE_SHARE = 0.5;

/** True when a reading is plainly of an upright page: enough sure words, and most of its words sure. */
export function readsUpright(tsv: string): boolean {
  const words = parseTsv(tsv).words.filter((w) => hasTwoAlphanumerics(w.text));
  const sure = words.filter(isSureWord).length;
  return sure >= MIN_SURE_WORDS && sure >= MIN_SURE_SHARE * words.length;
}
