import { describe, expect, it } from "vitest";
import {
  checkMachineRow,
  guessMachineMapping,
  readCalendarDate,
  type ImportContext,
} from "../../../shared/machines/machine-import.ts";

const ctx: ImportContext = {
  sites: [{ id: 7, name: "Main Plant" }],
  defaultSiteId: 7,
  builders: [{ id: 1, kind: "builder", name: "Vantor Machine Works", aliases: ["VMW"], active: true }],
  controls: [{ id: 2, kind: "control_family", name: "Kestle 40", aliases: ["K40"], active: true }],
  currentYear: 2026,
};

describe("machine import rows", () => {
  it("reads ISO and US spreadsheet dates and refuses days the calendar lacks (Gregorian leap rule)", () => {
    expect(readCalendarDate("2024-02-29")).toBe("2024-02-29");
    expect(readCalendarDate("2/29/2024")).toBe("2024-02-29");
    expect(readCalendarDate("2/29/2023")).toBeNull();
    // 1900 is not a leap year: divisible by 100 and not by 400.
    expect(readCalendarDate("1900-02-29")).toBeNull();
    expect(readCalendarDate("13/1/2020")).toBeNull();
    expect(readCalendarDate("June 3, 2019")).toBeNull();
  });

  it("maps a template's headers and common spreadsheet names to the fields", () => {
    expect(guessMachineMapping(["Builder", "CNC", "Technology", "Model", "Serial No.", "Year"])).toEqual({
      builder: "Builder",
      controlFamily: "CNC",
      technology: "Technology",
      model: "Model",
      serialNumber: "Serial No.",
      yearBuilt: "Year",
    });
  });

  it("stores the catalog's names for aliases and puts a row without a site at the chosen one", () => {
    const mapping = guessMachineMapping(["Builder", "Control", "Technology", "Model", "State"]);

    const row = checkMachineRow(
      2,
      { Builder: "vmw", Control: "K40", Technology: "Mill-turn", Model: "VT-2", State: "Out of service" },
      mapping,
      ctx,
    );

    expect(row.problems).toEqual([]);
    expect(row.input).toMatchObject({
      siteId: 7,
      builder: "Vantor Machine Works",
      controlFamily: "Kestle 40",
      technology: "mill_turn",
      state: "out_of_service",
    });
  });

  it("refuses a line break in a one-line cell but keeps it in the notes", () => {
    const mapping = guessMachineMapping(["Builder", "Control", "Technology", "Model", "Notes"]);

    const row = checkMachineRow(
      5,
      { Builder: "VMW", Control: "K40", Technology: "Mill", Model: "VM\n450", Notes: "a\r\nb" },
      mapping,
      ctx,
    );

    expect(row.problems).toEqual([
      { line: 5, column: "Model", field: "model", reason: "contains control characters" },
    ]);
    expect(row.key).toBeNull();
  });
});
