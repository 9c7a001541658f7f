import { describe, expect, it } from "vitest";
import { layoutText } from "../../../shared/credentials/locate-values.ts";
import {
  readingQuality,
  readsUpright,
  skewDegrees,
  tsvToPositionedText,
  uprightTurn,
} from "../../../shared/credentials/ocr-layout.ts";
import { proposeFields } from "../../../shared/credentials/extract-fields.ts";

const HEADER =
  "level\tpage_num\tblock_num\tpar_num\tline_num\tword_num\tleft\ttop\twidth\theight\tconf\ttext";
/** A tesseract TSV for a 1000 x 600 image: each word as [line, left, top, width, height, conf, text]. */
function tsv(words: Array<[number, number, number, number, number, number, string]>): string {
  const rows = [
    HEADER,
    "1\t1\t0\t0\t0\t0\t0\t0\t1000\t600\t-1\t",
    "2\t1\t1\t0\t0\t0\t40\t40\t900\t500\t-1\t",
  ];
  words.forEach(([line, left, top, width, height, conf, text], n) =>
    rows.push(`5\t1\t1\t1\t${line}\t${n + 1}\t${left}\t${top}\t${width}\t${height}\t${conf}\t${text}`),
  );
  return rows.join("\n");
}

describe("orientation detection output", () => {
  it("takes the clockwise quarter turn tesseract asks for", () => {
    const osd =
      "Page number: 0\nOrientation in degrees: 270\nRotate: 90\nOrientation confidence: 3.21\nScript: Latin";
    expect(uprightTurn(osd)).toBe(90);
    expect(uprightTurn(osd.replace("Rotate: 90", "Rotate: 180"))).toBe(180);
  });
  it("reads the page as it came when detection failed or had nothing to go on", () => {
    expect(uprightTurn("Too few characters. Skipping this page\nError during processing.")).toBe(0);
    expect(uprightTurn("Rotate: 180\nOrientation confidence: 0.00")).toBe(0);
    expect(uprightTurn("Rotate: 45\nOrientation confidence: 9")).toBe(0);
  });
});

describe("tesseract word boxes for the layout reader", () => {
  const page = tsv([
    [1, 40, 100, 60, 20, 95, "Name"],
    [1, 300, 96, 70, 26, 93, "Odile"],
    [1, 380, 100, 90, 22, 91, "Carrack"],
    [2, 40, 140, 80, 20, 90, "Course"],
    [2, 300, 140, 90, 20, 88, "Electrical"],
    [2, 400, 140, 70, 20, 87, "Safety"],
    [3, 40, 180, 50, 20, -1, ""],
  ]);

  it("gives each word its box as fractions of the image, with its line's top and height", () => {
    const items = tsvToPositionedText(page, 2);
    expect(items).toHaveLength(6);
    const odile = items.find((item) => item.text === "Odile")!;
    const carrack = items.find((item) => item.text === "Carrack")!;
    expect(odile).toMatchObject({ page: 2, x: 0.3, w: 0.07 });
    // "Odile" starts higher than "Carrack"; both take the line's top (96) and full height (96..122).
    expect(odile.y).toBeCloseTo(96 / 600);
    expect(carrack.y).toBeCloseTo(96 / 600);
    expect(carrack.h).toBeCloseTo(26 / 600);
  });

  it("rebuilds label and value cells the way a PDF's text items are rebuilt, so the card fields read", () => {
    const text = layoutText(tsvToPositionedText(page, 1));
    expect(text.split("\n")).toEqual(["Name   Odile Carrack", "Course   Electrical Safety"]);
    expect(proposeFields("lockout_tagout", "training", text).fields).toMatchObject({
      holderName: "Odile Carrack",
    });
  });

  it("joins a number tesseract split at its hyphen, but not words a space apart", () => {
    const split = tsv([
      [1, 40, 100, 80, 20, 95, "Policy"],
      [1, 300, 100, 36, 20, 91, "WC-"],
      [1, 340, 100, 70, 20, 88, "956167"],
      [2, 40, 140, 60, 20, 90, "Mid-"],
      [2, 140, 140, 60, 20, 90, "West"],
    ]);
    expect(tsvToPositionedText(split, 1).map((item) => item.text)).toEqual([
      "Policy",
      "WC-956167",
      "Mid-",
      "West",
    ]);
    const joined = tsvToPositionedText(split, 1)[1]!;
    expect(joined.x).toBeCloseTo(0.3);
    expect(joined.w).toBeCloseTo(0.11);
  });

  it("gives nothing for output without a page row", () => {
    expect(tsvToPositionedText("not a tsv", 1)).toEqual([]);
  });
});

describe("skew and reading quality", () => {
  it("measures lines falling to the right as a positive tilt, and level lines as none", () => {
    const fall = Math.tan((3 * Math.PI) / 180);
    const tilted = tsv(
      [0, 1, 2].flatMap((line) =>
        [0, 1, 2].map((n): [number, number, number, number, number, number, string] => [
          line + 1,
          100 + n * 200,
          100 + line * 60 + Math.round(n * 200 * fall),
          150,
          20,
          90,
          "word",
        ]),
      ),
    );
    expect(skewDegrees(tilted)).toBeCloseTo(3, 0);
    expect(
      skewDegrees(
        tsv([
          [1, 0, 10, 50, 20, 90, "a"],
          [1, 60, 10, 50, 20, 90, "b"],
          [1, 120, 10, 50, 20, 90, "c"],
          [2, 0, 50, 50, 20, 90, "d"],
          [2, 60, 50, 50, 20, 90, "e"],
          [2, 120, 50, 50, 20, 90, "f"],
        ]),
      ),
    ).toBe(0);
  });

  it("counts only the words tesseract is sure of, so an upside-down page scores low", () => {
    const upright = tsv([
      [1, 0, 0, 50, 20, 96, "Course"],
      [1, 60, 0, 50, 20, 91, "Safety"],
    ]);
    const upsideDown = tsv([
      [1, 0, 0, 50, 20, 31, "ÁʇǝɟɐS"],
      [1, 60, 0, 50, 20, 12, "es"],
      [1, 120, 0, 50, 20, 80, "'"],
    ]);
    expect(readingQuality(upright)).toBe(2);
    expect(readingQuality(upsideDown)).toBe(0);
  });

  it("takes a reading as upright only when most of its words are sure, not on a dozen sure fragments", () => {
    type Word = [number, number, number, number, number, number, string];
    const words = (sure: number, unsure: number): Word[] => [
      ...Array.from({ length: sure }, (_, n): Word => [1, n * 10, 0, 8, 20, 90, "Policy"]),
      ...Array.from({ length: unsure }, (_, n): Word => [2, n * 10, 40, 8, 20, 30, "oq"]),
    ];
    expect(readsUpright(tsv(words(74, 10)))).toBe(true);
    // The counts of a blurred certificate photographed sideways and read at the wrong quarter turn.
    expect(readsUpright(tsv(words(12, 81)))).toBe(false);
    // Every word sure, but too few to tell a sparse upright page from stray marks.
    expect(readsUpright(tsv(words(5, 0)))).toBe(false);
  });
});

describe("levelling the word boxes of a tilted page", () => {
  const fall = Math.tan((3 * Math.PI) / 180);
  type Word = [number, number, number, number, number, number, string];
  // Two lines of five words, 200 px apart, falling 3 degrees to the right.
  const tilted = tsv(
    [0, 1].flatMap((line) =>
      [0, 1, 2, 3, 4].map((n): Word => [
        line + 1,
        50 + n * 190,
        150 + line * 200 + Math.round(n * 190 * fall),
        150,
        20,
        90,
        "word",
      ]),
    ),
  );

  it("puts each line's words at one height when given the measured tilt", () => {
    const skew = skewDegrees(tilted);
    expect(skew).toBeCloseTo(3, 0);
    const asRead = tsvToPositionedText(tilted, 1);
    const level = tsvToPositionedText(tilted, 1, skew);
    // Read as it came, a line's box spans the whole fall (about 40 px of 600); levelled, one word's height (20 px).
    expect(asRead[0]!.h * 600).toBeGreaterThan(55);
    expect(level[0]!.h * 600).toBeCloseTo(20, -1);
    expect(level[0]!.h * 600).toBeLessThan(25);
    // Lines keep their order and their distance apart.
    expect((level[5]!.y - level[0]!.y) * 600).toBeCloseTo(200, -1);
  });
});
