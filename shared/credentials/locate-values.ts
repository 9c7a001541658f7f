import { formatDocumentDate, documentDateFormats } from "./date-formats.ts";

/** A piece of text on a page, its box as fractions of the page's width and height (top-left origin). */
export interface PositionedText {
  page: number;
  text: string;
  x: number;
  y: number;
  w: number;
  h: number;
  /** Font size as a fraction of the page's width, to tell a word space from a gap between columns. */
  em?: number;
}
export type PageBox = Omit<PositionedText, "text" | "em">;

/** Where a proposed value was read and how sure the reader is, for the reviewer's side-by-side page. */
export interface FieldEvidence {
  /** 0 to 1: 0.9 when the value was found once on the page from its text layer; lower for OCR or doubtful finds. */
  confidence: number;
  box?: PageBox;
}
export type Evidence = Record<string, FieldEvidence>;

/** Below this a field is marked for a closer look. */
export const LOW_CONFIDENCE = 0.6;

// A gap wider than this many font sizes separates two cells (columns, or a label and its value across the page).
const CELL_GAP_EMS = 1.5;

/**
 * The page's text rebuilt from positioned items: items on one baseline form a line, read left to right, and a wide
 * gap between two items becomes three spaces, so the readers see "Name   Odile Carrack" as a label and a value in two
 * cells, as they would in a table, rather than one run of words. A cell wrapped onto the next line is joined back.
 */
export function layoutText(items: readonly PositionedText[]): string {
  const order = [...items].sort((a, b) => a.page - b.page || a.y - b.y || a.x - b.x);
  const baselines: PositionedText[][] = [];
  for (const item of order) {
    const last = baselines[baselines.length - 1];
    const head = last?.[0];
    if (last && head && head.page === item.page && Math.abs(item.y - head.y) < Math.max(head.h, item.h) / 2)
      last.push(item);
    else baselines.push([item]);
  }
  const lines = joinWrappedCells(splitColumns(baselines).map(toCells));
  const out: string[] = [];
  let page = lines[0]?.page ?? 1;
  for (const line of lines) {
    if (line.page !== page) {
      out.push("");
      page = line.page;
    }
    out.push(
      line.cells
        .map((cell) => cell.text)
        .join("   ")
        .trimEnd(),
    );
  }
  return out.join("\n");
}

interface Cell {
  x: number;
  text: string;
}
interface CellLine {
  page: number;
  y: number;
  h: number;
  em: number;
  cells: Cell[];
}

function toCells(line: readonly PositionedText[]): CellLine {
  const sorted = [...line].sort((a, b) => a.x - b.x);
  const cells: Cell[] = [];
  let right = 0;
  for (const item of sorted) {
    const em = item.em ?? item.h / 1.2;
    const gap = item.x - right;
    const cell = cells[cells.length - 1];
    if (!cell || gap > CELL_GAP_EMS * em) cells.push({ x: item.x, text: item.text });
    else cell.text += (gap > em * 0.15 ? " " : "") + item.text;
    right = Math.max(right, item.x + item.w);
  }
  const first = sorted[0]!;
  return {
    page: first.page,
    y: Math.min(...sorted.map((item) => item.y)),
    h: Math.max(...sorted.map((item) => item.h)),
    em: first.em ?? first.h / 1.2,
    cells,
  };
}

// Two cells start in the same place when their left edges are within half a font size (OCR boxes wander a little).
const ALIGN_EMS = 0.5;
// A wrapped line sits one line below the last; rows of a table or form are spaced wider than this.
const WRAP_PITCH_LINES = 1.5;
// A wrapped label or phrase carries on mid-sentence, in lower case; a new row's label starts with a capital.
const CARRIES_ON = /^[a-z][a-z]/;
// A line of its own label ("Expires: ...") is a new row even when it starts under a value.
const OWN_LABEL = /^[A-Za-z][^:]{0,30}:/;

/**
 * A cell wrapped onto the line below is joined back to its cell, so a reader that sees lines gets the whole value:
 * a line whose only cell starts under the last cell of the line above (the label column left blank) continues that
 * value; a line whose cells start under the cells of the line above, the first carrying on in lower case, continues
 * each of them (a label and its value both wrapped). Only a line one line-height below is taken, never a row.
 */
function joinWrappedCells(lines: CellLine[]): CellLine[] {
  const out: CellLine[] = [];
  for (const line of lines) {
    const above = out[out.length - 1];
    const near =
      above !== undefined &&
      above.page === line.page &&
      line.y > above.y &&
      line.y - above.y < WRAP_PITCH_LINES * Math.max(above.h, line.h);
    const aligned = (a: Cell, b: Cell) => Math.abs(a.x - b.x) < ALIGN_EMS * line.em;
    const last = above?.cells[above.cells.length - 1];
    const first = line.cells[0]!;
    if (near && last && above!.cells.length > 1 && line.cells.length === 1 && aligned(first, last)) {
      if (!OWN_LABEL.test(first.text)) {
        last.text += ` ${first.text}`;
        above!.y = line.y;
        continue;
      }
    }
    if (
      near &&
      CARRIES_ON.test(first.text) &&
      line.cells.length <= above!.cells.length &&
      line.cells.every((cell, i) => aligned(cell, above!.cells[i]!))
    ) {
      line.cells.forEach((cell, i) => (above!.cells[i]!.text += ` ${cell.text}`));
      above!.y = line.y;
      continue;
    }
    out.push(line);
  }
  return out;
}

// A column must be repeated on at least this many lines before a page is read as side-by-side columns.
const MIN_COLUMN_ROWS = 3;

const firstWord = (text: string) => /^[A-Za-z][A-Za-z.'-]{2,}/.exec(text.trim())?.[0]?.toLowerCase();

function cellStarts(line: readonly PositionedText[]): PositionedText[] {
  const cells = [...line].sort((a, b) => a.x - b.x);
  const starts: PositionedText[] = [];
  let right = -1;
  for (const item of cells) {
    const em = item.em ?? item.h / 1.2;
    if (right < 0 || item.x - right > CELL_GAP_EMS * em) starts.push(item);
    right = Math.max(right, item.x + item.w);
  }
  return starts;
}

/**
 * Blocks printed side by side (two coverages in two columns) share baselines, so reading each baseline across the page
 * would join the left block's values to the right block's labels. A gutter is taken to exist where the same label
 * word opens a line and opens a cell further right on several lines; over the run of lines no item crosses it, the
 * left column is read first, then the right. A table of labels and values never repeats its label word across a row,
 * so it stays one column.
 */
function splitColumns(lines: PositionedText[][]): PositionedText[][] {
  const votes = new Map<string, number>();
  const openings = lines.map((line) => firstWord(cellStarts(line)[0]?.text ?? ""));
  for (const [at, line] of lines.entries()) {
    const starts = cellStarts(line);
    // The right block may start a line lower or higher than the left (a heading wrapped in one of them), so its
    // label word is looked for as the opening of this line or of the one above or below.
    const near = [at - 1, at, at + 1]
      .filter((i) => lines[i]?.[0]?.page === line[0]?.page)
      .map((i) => openings[i])
      .filter((word): word is string => word !== undefined);
    if (near.length === 0) continue;
    for (const cell of starts.slice(1))
      if (cell.x > 0.3 && near.includes(firstWord(cell.text) ?? "")) {
        const key = `${cell.page}:${cell.x.toFixed(2)}`;
        votes.set(key, (votes.get(key) ?? 0) + 1);
      }
  }
  const gutters = new Map<number, number>();
  for (const [key, n] of votes) {
    const [page, x] = key.split(":").map(Number) as [number, number];
    if (n >= MIN_COLUMN_ROWS && x < (gutters.get(page) ?? Infinity)) gutters.set(page, x - 0.005);
  }
  if (gutters.size === 0) return lines;
  const out: PositionedText[][] = [];
  let index = 0;
  while (index < lines.length) {
    const line = lines[index]!;
    const gutter = gutters.get(line[0]!.page);
    const crosses = (l: PositionedText[]) =>
      gutter === undefined || l.some((item) => item.x < gutter && item.x + item.w > gutter);
    if (crosses(line)) {
      out.push(line);
      index += 1;
      continue;
    }
    const run: PositionedText[][] = [];
    while (
      index < lines.length &&
      lines[index]![0]!.page === line[0]!.page &&
      !crosses(lines[index]!) &&
      !(run.length > 0 && belowColumns(run, lines[index]!, gutter!))
    )
      run.push(lines[(index += 1) - 1]!);
    const left = run.map((l) => l.filter((item) => item.x < gutter!)).filter((l) => l.length > 0);
    const right = run.map((l) => l.filter((item) => item.x >= gutter!)).filter((l) => l.length > 0);
    out.push(...left, ...right);
  }
  return out;
}

// A gap of more than this many line heights under both columns ends them: what follows spans the page.
const BELOW_COLUMNS_LINES = 1.5;

/**
 * A heading printed under the columns ("Description of operations") is short enough to sit left of the gutter, but
 * it follows the two blocks, not the left one: a line with nothing right of the gutter, set off by a wider gap than
 * a line's from everything above it, ends the run of columns.
 */
function belowColumns(run: PositionedText[][], line: PositionedText[], gutter: number): boolean {
  if (line.some((item) => item.x >= gutter)) return false;
  const top = Math.min(...line.map((item) => item.y));
  const above = Math.max(...run.flat().map((item) => item.y));
  const height = Math.max(...line.map((item) => item.h));
  return top - above > BELOW_COLUMNS_LINES * height;
}

interface Line {
  page: number;
  text: string;
  /** For each character of text, the item it came from. */
  owners: number[];
}

const squash = (text: string) => text.toLowerCase().replace(/\s+/g, " ");

// Items on one baseline (within half a line) are one line, read left to right.
function buildLines(items: readonly PositionedText[]): Line[] {
  const order = items
    .map((item, index) => ({ item, index }))
    .sort((a, b) => a.item.page - b.item.page || a.item.y - b.item.y || a.item.x - b.item.x);
  const lines: { page: number; y: number; h: number; members: number[] }[] = [];
  for (const { item, index } of order) {
    const last = lines[lines.length - 1];
    if (last && last.page === item.page && Math.abs(item.y - last.y) < Math.max(last.h, item.h) / 2) {
      last.members.push(index);
    } else lines.push({ page: item.page, y: item.y, h: item.h, members: [index] });
  }
  return lines.map((line) => {
    const members = [...line.members].sort((a, b) => items[a]!.x - items[b]!.x);
    let text = "";
    const owners: number[] = [];
    for (const member of members) {
      const piece = squash(items[member]!.text);
      if (text !== "" && !text.endsWith(" ")) {
        text += " ";
        owners.push(member);
      }
      text += piece;
      for (let i = 0; i < piece.length; i += 1) owners.push(member);
    }
    return { page: line.page, text, owners };
  });
}

function unionBox(items: readonly PositionedText[], members: Iterable<number>): PageBox | undefined {
  let box: PageBox | undefined;
  for (const member of members) {
    const item = items[member];
    if (!item) continue;
    if (!box) {
      box = { page: item.page, x: item.x, y: item.y, w: item.w, h: item.h };
      continue;
    }
    const right = Math.max(box.x + box.w, item.x + item.w);
    const bottom = Math.max(box.y + box.h, item.y + item.h);
    box.x = Math.min(box.x, item.x);
    box.y = Math.min(box.y, item.y);
    box.w = right - box.x;
    box.h = bottom - box.y;
  }
  return box;
}

/** The ways a value may be printed: the text itself, a date in each format, an amount with or without commas. */
function printedForms(value: unknown): string[] {
  if (typeof value === "number") {
    const forms = [value.toLocaleString("en-US"), String(value)];
    if (value >= 1_000_000 && value % 1_000_000 === 0)
      forms.push(`${value / 1_000_000}m`, `${value / 1_000_000}mm`);
    if (value >= 1_000 && value % 1_000 === 0) forms.push((value / 1_000).toLocaleString("en-US"));
    return forms;
  }
  if (typeof value !== "string" || value.trim().length < 2) return [];
  if (/^\d{4}-\d{2}-\d{2}$/.test(value)) return documentDateFormats.map((f) => formatDocumentDate(value, f));
  return [value];
}

function matches(lines: Line[], items: readonly PositionedText[], form: string): PageBox[] {
  const needle = squash(form.trim());
  const found: PageBox[] = [];
  for (const line of lines) {
    let at = line.text.indexOf(needle);
    while (at >= 0) {
      const before = line.text[at - 1];
      const after = line.text[at + needle.length];
      // Whole values only: "1,000,000" is not found inside "11,000,000".
      if (!/[\w,]/.test(before ?? " ") && !/[\w]/.test(after ?? " ")) {
        const box = unionBox(items, new Set(line.owners.slice(at, at + needle.length)));
        if (box) found.push(box);
      }
      at = line.text.indexOf(needle, at + 1);
    }
  }
  return found;
}

const flatten = (fields: Record<string, unknown>, prefix = ""): [string, unknown][] =>
  Object.entries(fields).flatMap(([key, value]) =>
    value && typeof value === "object" && !Array.isArray(value)
      ? flatten(value as Record<string, unknown>, `${prefix}${key}.`)
      : [[`${prefix}${key}`, value] as [string, unknown]],
  );

const distance = (a: PageBox, b: PageBox) =>
  (a.page - b.page) * 10 + Math.abs(a.y + a.h / 2 - (b.y + b.h / 2)) + Math.abs(a.x - b.x) / 4;

/**
 * Finds where each proposed value sits on the page. A value printed in several places (the same $1,000,000 in two
 * coverages) is placed nearest the field that anchors its coverage (the policy number) and trusted less; a value
 * the page does not show in any printed form is marked low; values read by OCR are placed by tesseract's word boxes.
 */
export function locateValues(
  fields: Record<string, unknown>,
  found: readonly string[],
  items: readonly PositionedText[],
  method: "pdf_text" | "ocr" | "none",
): Evidence {
  const evidence: Evidence = {};
  const lines = buildLines(items);
  const values = new Map(flatten(fields));
  const locate = (path: string) => {
    const boxes = printedForms(values.get(path)).flatMap((form) => matches(lines, items, form));
    return [...new Map(boxes.map((box) => [`${box.page}:${box.x}:${box.y}`, box])).values()];
  };
  const anchor = locate("policyNumber")[0];
  for (const path of found) {
    const value = values.get(path);
    if (typeof value === "boolean") {
      // A mark is read from its column; the box of a one-letter mark cannot be told from other letters reliably.
      evidence[path] = { confidence: method === "pdf_text" ? 0.7 : 0.4 };
      continue;
    }
    const boxes = method === "none" ? [] : locate(path);
    if (boxes.length === 0) {
      evidence[path] = { confidence: 0.5 };
      continue;
    }
    const sorted = anchor ? [...boxes].sort((a, b) => distance(a, anchor) - distance(b, anchor)) : boxes;
    // OCR may misread a letter the text layer would not, so a value found by its word boxes is trusted a step less.
    const penalty = method === "ocr" ? 0.15 : 0;
    const confidence = (boxes.length === 1 ? 0.9 : anchor ? 0.75 : 0.55) - penalty;
    evidence[path] = { confidence: Math.round(confidence * 100) / 100, box: sorted[0]! };
  }
  return evidence;
}
