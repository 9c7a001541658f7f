import Papa from "papaparse";
import { rosterCsvColumns, standingWords, type RosterEntryDto } from "../../shared/roster/schemas.ts";

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
  // Cells starting with = + - @ are escaped so a spreadsheet never runs them as formulas (OWASP "CSV Injection").
  return Papa.unparse({ fields: [...rosterCsvColumns], data }, { escapeFormulae: true });
}
