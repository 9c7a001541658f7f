import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  findDocumentDates,
  formatDocumentDate,
  parseDocumentDate,
  parseDocumentEndDate,
  parseDocumentMonth,
} from "../../../shared/credentials/date-formats.ts";
import { trainingLapseInstant } from "../../../shared/standing/training-validity.ts";

const isoDate = (year: number, month: number, day: number) =>
  `${year}-${String(month).padStart(2, "0")}-${String(day).padStart(2, "0")}`;

describe("document dates", () => {
  it("reads MM/DD/YYYY, M/D/YY and ISO as the same calendar date", () => {
    const printed = ["03/07/2026", "3/7/26", "2026-03-07"];

    const read = printed.map(parseDocumentDate);

    expect(read).toEqual(["2026-03-07", "2026-03-07", "2026-03-07"]);
  });

  it("reads dates with the month spelled out, day first or month first", () => {
    const printed = ["15 Mar 2027", "15-Mar-2027", "March 15, 2027", "Mar. 15 2027", "Sept 3, 2026"];

    const read = printed.map(parseDocumentDate);

    expect(read).toEqual(["2027-03-15", "2027-03-15", "2027-03-15", "2027-03-15", "2026-09-03"]);
  });

  it("finds spelled-out dates inside a line", () => {
    const line = "Completed on 15 Mar 2025 and valid through March 15, 2027.";

    const dates = findDocumentDates(line);

    expect(dates).toEqual(["2025-03-15", "2027-03-15"]);
  });

  it("does not take a month and year for a full date, but reads it as one", () => {
    const printed = ["03/2027", "3-2027", "March 2027", "Feb 2028"];

    const asDate = printed.map(parseDocumentDate);
    const asMonth = printed.map(parseDocumentMonth);

    expect(asDate).toEqual([null, null, null, null]);
    expect(asMonth).toEqual([
      { year: 2027, month: 3 },
      { year: 2027, month: 3 },
      { year: 2027, month: 3 },
      { year: 2028, month: 2 },
    ]);
  });

  it("reads a month-only renewal as valid through the last day of that month (common practice)", () => {
    const printed = ["03/2027", "02/2028", "04/2027", "13/2027"];

    const read = printed.map(parseDocumentEndDate);

    expect(read).toEqual(["2027-03-31", "2028-02-29", "2027-04-30", null]);
  });

  it("lapses a month-only card the same way as a card printing that last day", () => {
    const validity = { kind: "months_from_issue", months: 24 } as const;
    const monthOnly = parseDocumentEndDate("Recommended renewal: 03/2027".split(": ")[1] ?? "")!;

    const lapses = trainingLapseInstant(
      validity,
      { issueDate: "2025-03-04", expiryDate: monthOnly },
      "America/Chicago",
    );
    const dayCard = trainingLapseInstant(
      validity,
      { issueDate: "2025-03-04", expiryDate: "2027-03-31" },
      "America/Chicago",
    );

    // Valid through the end of the month: lapses at the start of 1 April, local time.
    expect(lapses?.toISOString()).toBe("2027-04-01T05:00:00.000Z");
    expect(lapses).toEqual(dayCard);
  });

  it("reads an OCR'd letter O as a zero and ignores stray spaces", () => {
    const printed = "O1/ 15/2O26";

    const read = parseDocumentDate(printed);

    expect(read).toBe("2026-01-15");
  });

  it("refuses dates that do not exist", () => {
    const printed = ["02/30/2026", "13/01/2026", "2026-02-29", "00/10/2026"];

    const read = printed.map(parseDocumentDate);

    expect(read).toEqual([null, null, null, null]);
  });

  it("accepts 29 February only in a leap year", () => {
    const printed = ["02/29/2028", "02/29/2027"];

    const read = printed.map(parseDocumentDate);

    expect(read).toEqual(["2028-02-29", null]);
  });

  it("places two-digit years 00-68 in this century and 69-99 in the last (POSIX %y rule)", () => {
    const printed = ["1/2/68", "1/2/69"];

    const read = printed.map(parseDocumentDate);

    expect(read).toEqual(["2068-01-02", "1969-01-02"]);
  });

  it("finds every date in a line in reading order", () => {
    const line = "GLP-5778376 01/15/2026 2027-01-15 EACH OCCURRENCE $ 1,000,000";

    const dates = findDocumentDates(line);

    expect(dates).toEqual(["2026-01-15", "2027-01-15"]);
  });

  it("round-trips any real date through each printed format", () => {
    const realDate = fc
      .record({
        year: fc.integer({ min: 1969, max: 2068 }),
        month: fc.integer({ min: 1, max: 12 }),
        day: fc.integer({ min: 1, max: 31 }),
      })
      .filter(({ year, month, day }) => day <= new Date(Date.UTC(year, month, 0)).getUTCDate())
      .map(({ year, month, day }) => isoDate(year, month, day));
    const format = fc.constantFrom("MM/DD/YYYY" as const, "M/D/YY" as const, "YYYY-MM-DD" as const);

    const property = fc.property(
      realDate,
      format,
      (iso, printedAs) => parseDocumentDate(formatDocumentDate(iso, printedAs)) === iso,
    );

    fc.assert(property, { numRuns: 500 });
  });

  it("round-trips four-digit years outside the two-digit window", () => {
    const realDate = fc.date({
      min: new Date("1900-01-01T00:00:00Z"),
      max: new Date("2199-12-31T00:00:00Z"),
      noInvalidDate: true,
    });

    const property = fc.property(
      realDate,
      fc.constantFrom("MM/DD/YYYY" as const, "YYYY-MM-DD" as const),
      (date, printedAs) => {
        const iso = date.toISOString().slice(0, 10);
        return parseDocumentDate(formatDocumentDate(iso, printedAs)) === iso;
      },
    );

    fc.assert(property, { numRuns: 300 });
  });
});
