import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import {
  KM_PER_STATUTE_MILE,
  formatMiles,
  kmToMiles,
  milesToKm,
  wholeKmFromMiles,
  wholeMilesFromKm,
} from "../../../shared/geo/units.ts";

const root = path.resolve(import.meta.dirname, "../../..");

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) return sourceFiles(full);
    return /\.(ts|tsx)$/.test(name) ? [full] : [];
  });
}

/** Comments may name the stored unit; only code and text can reach a reader. */
const withoutComments = (text: string) =>
  text.replace(/\/\*[\s\S]*?\*\//g, "").replace(/(^|[^:])\/\/.*$/gm, "$1");

describe("distances in miles", () => {
  it("uses the international mile of exactly 1,609.344 m (international yard and pound agreement, 1959)", () => {
    expect(KM_PER_STATUTE_MILE).toBe(1.609344);
    expect(kmToMiles(1.609344)).toBe(1);
    expect(milesToKm(100)).toBeCloseTo(160.9344, 10);
  });

  it("formats a distance in miles, one decimal under ten miles", () => {
    expect(formatMiles(1.609344)).toBe("1 mile");
    expect(formatMiles(12)).toBe("7.5 miles");
    expect(formatMiles(160.9344)).toBe("100 miles");
  });

  it("gives back the whole miles a person typed after storing whole kilometres", () => {
    for (let miles = 1; miles <= 1240; miles++) expect(wholeMilesFromKm(wholeKmFromMiles(miles))).toBe(miles);
  });

  it("shows no kilometres anywhere in the client's code or text", () => {
    const offenders = [
      ...sourceFiles(path.join(root, "src")),
      ...sourceFiles(path.join(root, "server/work-orders")),
    ]
      .filter((file) => /\bkm\b|kilomet/i.test(withoutComments(readFileSync(file, "utf8"))))
      .map((file) => path.relative(root, file));

    expect(offenders).toEqual([]);
  });
});
