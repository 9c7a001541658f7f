import { describe, expect, it } from "vitest";
import { documentDateProblems } from "../../../shared/credentials/document-dates.ts";
import { preferredDateProblem } from "../../../shared/work-orders/preferred-dates.ts";
import { addCalendarDays } from "../../../shared/standing/iso-date.ts";
import { policyEndInstant } from "../../../shared/standing/policy-period.ts";
import { endOfValidThroughInstant } from "../../../shared/standing/training-validity.ts";
import { parseDocumentDate } from "../../../shared/credentials/date-formats.ts";

describe("document date rules", () => {
  it("refuses an expiry before the issue date and an expiration before the effective date", () => {
    expect(documentDateProblems({ issueDate: "2026-03-02", expiryDate: "2026-03-01" })).toEqual([
      { path: "expiryDate", message: "The expiry date is before the issue date" },
    ]);
    expect(documentDateProblems({ effectiveDate: "2026-03-02", expirationDate: "2025-03-02" })).toEqual([
      { path: "expirationDate", message: "The expiration date is before the effective date" },
    ]);
  });

  it("leaves an end on the start date to the reviewer", () => {
    expect(documentDateProblems({ issueDate: "2026-03-02", expiryDate: "2026-03-02" })).toEqual([]);
  });

  it.each(["0000-01-01", "0099-12-31", "1949-12-31", "2101-01-01"])("refuses the year of %s", (date) => {
    expect(documentDateProblems({ issueDate: date })).toEqual([
      { path: "issueDate", message: "Use a year from 1950 to 2100" },
    ]);
  });

  it.each(["1950-01-01", "2100-12-31"])("accepts %s at the edge of the window", (date) => {
    expect(documentDateProblems({ issueDate: date })).toEqual([]);
  });
});

describe("computed dates agree with the date written", () => {
  it("keeps years below 100 as written instead of moving them to the 1900s", () => {
    expect(addCalendarDays("0099-12-31", 1)).toBe("0100-01-01");
    expect(addCalendarDays("0000-12-31", 1)).toBe("0001-01-01");
    expect(endOfValidThroughInstant("0099-06-30", "UTC").toISOString()).toBe("0099-07-01T00:00:00.000Z");
    expect(policyEndInstant("0099-06-01", "UTC").getUTCFullYear()).toBe(99);
  });

  it("reads 29 February of year 0 as a real date (0 is a leap year in the proleptic calendar, 1900 is not)", () => {
    expect(parseDocumentDate("0000-02-29")).toBe("0000-02-29");
    expect(parseDocumentDate("1900-02-29")).toBeNull();
  });
});

describe("preferred visit dates", () => {
  it.each([
    ["2026-12-01", null],
    ["2026-11-30", "Choose a date from today on"],
    ["1900-01-01", "Choose a date from today on"],
    ["2028-12-02", null],
    ["2028-12-03", "Choose a date within 2 years"],
    ["2999-01-01", "Choose a date within 2 years"],
  ])("as of 2026-12-02, %s gives %s", (date, problem) => {
    expect(preferredDateProblem(date, "2026-12-02")).toBe(problem);
  });
});
