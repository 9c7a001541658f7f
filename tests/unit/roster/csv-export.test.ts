import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { rosterToCsv } from "../../../server/roster/csv-export.ts";
import type { RosterEntryDto } from "../../../shared/roster/schemas.ts";

function entryNamed(name: string, companyName = "Harrowgate Spindle Co.", id = 1): RosterEntryDto {
  return {
    id,
    kind: "technician",
    technicianId: id,
    serviceCompanyId: null,
    name,
    companyName,
    addedAt: "2026-11-30T12:00:00.000Z",
    technicians: [
      {
        technicianId: id,
        name,
        companyId: 7,
        companyName,
        active: true,
        standing: "cleared",
        nextLapse: null,
      },
    ],
  };
}

function cellsOf(csv: string): string[][] {
  return Papa.parse<string[]>(csv.trim()).data;
}

// OWASP "CSV Injection": a cell starting with = + - @ tab or CR is treated as a formula by spreadsheets.
describe("roster CSV formula escaping", () => {
  it.each([
    ['=HYPERLINK("http://x.test","open")\n&""', "equals sign with a line break"],
    ["+1+2\r\nmore", "plus sign with CRLF"],
    ["-2\nline", "minus sign with a line break"],
    ["@SUM(A1)\n", "at sign ending in a line break"],
    ["\tcmd\nx", "tab then a line break"],
    ["\rcmd", "carriage return"],
    ["=1+2", "single-line formula"],
  ])("escapes %j (%s) whatever follows the first character", (payload) => {
    const csv = rosterToCsv([entryNamed(payload, payload)]);

    const rows = cellsOf(csv);

    expect(rows).toHaveLength(2);
    expect(rows[1]?.[0]).toBe(`'${payload}`);
    expect(rows[1]?.[1]).toBe(`'${payload}`);
  });

  it("leaves a name that merely contains a formula character alone", () => {
    const csv = rosterToCsv([entryNamed("Ana Ruiz-Okafor\n=2nd shift")]);

    expect(cellsOf(csv)[1]?.[0]).toBe("Ana Ruiz-Okafor\n=2nd shift");
  });
});
