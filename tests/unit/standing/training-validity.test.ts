import fc from "fast-check";
import { DateTime } from "luxon";
import { describe, expect, it } from "vitest";
import { credentialTypeByCode } from "../../../shared/credentials/catalogue.ts";
import {
  addCalendarMonths,
  trainingLapseInstant,
  trainingValidThrough,
} from "../../../shared/standing/training-validity.ts";

function validityOf(code: string) {
  const type = credentialTypeByCode.get(code);
  if (!type) throw new Error(`No type ${code}`);
  return type.validity;
}

describe("adding calendar months", () => {
  // Month clamping as date-fns 4.4.0 addMonths and luxon 3.7.2 plus({months}) compute it.
  it.each([
    { start: "2024-01-31", months: 1, result: "2024-02-29" },
    { start: "2023-01-31", months: 1, result: "2023-02-28" },
    { start: "2024-03-31", months: 1, result: "2024-04-30" },
    { start: "2024-01-31", months: 2, result: "2024-03-31" },
    { start: "2024-02-29", months: 12, result: "2025-02-28" },
    { start: "2024-02-29", months: 36, result: "2027-02-28" },
    { start: "2025-08-31", months: 6, result: "2026-02-28" },
  ])("clamps $start + $months months to $result", ({ start, months, result }) => {
    const sum = addCalendarMonths(start, months);

    expect(sum).toBe(result); // date-fns 4.4.0 addMonths and luxon 3.7.2 plus({months})
  });

  it("differs from adding one month twice, so the total is always added to the original date", () => {
    const chained = addCalendarMonths(addCalendarMonths("2024-01-31", 1), 1);
    const total = addCalendarMonths("2024-01-31", 2);

    expect(chained).toBe("2024-03-29"); // date-fns 4.4.0 addMonths: chaining is not the same as adding 2
    expect(total).toBe("2024-03-31"); // date-fns 4.4.0 addMonths and luxon 3.7.2 plus({months})
  });

  it("agrees with luxon's plus({ months }) on random dates", () => {
    const dates = fc.date({
      min: new Date("1950-01-01T00:00:00Z"),
      max: new Date("2150-12-31T00:00:00Z"),
      noInvalidDate: true,
    });

    fc.assert(
      fc.property(dates, fc.integer({ min: -240, max: 240 }), (date, months) => {
        const iso = date.toISOString().slice(0, 10);

        const ours = addCalendarMonths(iso, months);
        const luxons = DateTime.fromISO(iso, { zone: "UTC" }).plus({ months }).toISODate();

        expect(ours).toBe(luxons); // luxon 3.7.2 plus({months}) clamps the same way
      }),
      { numRuns: 2000 },
    );
  });
});

describe("training validity", () => {
  it("needs arc-flash retraining within 36 months of the issue date", () => {
    const validThrough = trainingValidThrough(validityOf("arc_flash"), { issueDate: "2024-05-15" });

    expect(validThrough).toBe("2027-05-15"); // NFPA 70E (2024) 110.6(A)(3): intervals not to exceed 3 years
  });

  it("needs a forklift operator evaluation every 3 years, clamped from a leap day", () => {
    const validThrough = trainingValidThrough(validityOf("powered_truck"), { issueDate: "2024-02-29" });

    expect(validThrough).toBe("2027-02-28"); // 29 CFR 1910.178(l)(4)(iii), OSHA letter 2005-08-01
  });

  it("treats lockout/tagout as a 12-month refresher", () => {
    const validThrough = trainingValidThrough(validityOf("lockout_tagout"), { issueDate: "2026-03-10" });

    // Common practice that a site may require: 29 CFR 1910.147(c)(7)(iii) sets no calendar interval.
    expect(validThrough).toBe("2027-03-10");
  });

  it("treats first aid / CPR as valid for 24 months", () => {
    const validThrough = trainingValidThrough(validityOf("first_aid_cpr"), { issueDate: "2025-03-10" });

    expect(validThrough).toBe("2027-03-10"); // common practice (2-year cards, American Heart Association)
  });

  it("lets the expiry printed on the card win over the type's interval", () => {
    const validThrough = trainingValidThrough(validityOf("first_aid_cpr"), {
      issueDate: "2025-03-10",
      expiryDate: "2027-03-31",
    });

    expect(validThrough).toBe("2027-03-31"); // AHA cards run through the end of the month (cpr.heart.org "Course Card Information")
  });

  it("never lapses an outreach card without a printed expiry", () => {
    const lapse = trainingLapseInstant(validityOf("osha_10"), { issueDate: "2015-06-01" }, "America/Chicago");

    expect(lapse).toBeNull(); // osha.gov Outreach FAQ: no federal expiry
  });

  it("counts a card through its valid-through date and stops at the next local midnight", () => {
    const lapse = trainingLapseInstant(
      validityOf("arc_flash"),
      { issueDate: "2024-05-15" },
      "America/Chicago",
    );

    // Common practice (our convention): valid through 2027-05-15 in the holder's zone; 00:00 CDT on 05-16 = 05:00Z.
    expect(lapse?.toISOString()).toBe("2027-05-16T05:00:00.000Z");
  });

  it("ends a printed expiry at local midnight, not UTC midnight", () => {
    const lapse = trainingLapseInstant(
      validityOf("oem_training"),
      { issueDate: "2025-01-10", expiryDate: "2027-01-10" },
      "America/Los_Angeles",
    );

    expect(lapse?.toISOString()).toBe("2027-01-11T08:00:00.000Z"); // common practice: 00:00 PST on the day after the printed date
  });
});
