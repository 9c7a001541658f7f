import Papa from "papaparse";
import { rosterCsvColumns, standingWords, type RosterEntryDto } from "../../shared/roster/schemas.ts";

/**
 * A cell whose first character is = + - @ tab or carriage return is prefixed with a quote so a spreadsheet never
 * runs it as a formula (OWASP "CSV Injection"). Only the first character counts: the library's own pattern
 * (`^[=+\-@\t\r].*$`) fails on a cell with a line break, which would reach the spreadsheet live.
 */
export const formulaStart = /^[=+\-@\t\r]/;

/**
 * The roster as CSV for the shop's quality records: one line per technician (a company entry lists each of its
 * technicians), instants in ISO 8601 UTC so the file sorts and imports without a zone guess.
 */
export function rosterToCsv(entries: RosterEntryDto[]): string {
  const seen = new Set<number>();
  const data: string[][] = [];
  for (const entry of entries) {
    for (const t of entry.technicians) {
      if (seen.has(t.technicianId)) continue;
      seen.add(t.technicianId);
      data.push([
        t.name,
        t.companyName,
        t.standing ? standingWords[t.standing] : "Not computed",
        t.nextLapse ?? "",
        entry.addedAt,
      ]);
    }
  }
  return Papa.unparse({ fields: [...rosterCsvColumns], data }, { escapeFormulae: formulaStart });
}
