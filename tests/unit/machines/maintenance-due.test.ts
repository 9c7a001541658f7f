import { DateTime } from "luxon";
import { describe, expect, it } from "vitest";
import {
  hoursPerDay,
  maintenanceWindow,
  nextDueOnByMonths,
  planDue,
  reminderThresholdFor,
} from "../../../shared/machines/maintenance-due.ts";
import { addCalendarMonths } from "../../../shared/standing/training-validity.ts";

const monthly = (months: number, lastDoneOn: string) => ({
  interval: { kind: "months" as const, months },
  lastDoneOn,
  lastDoneHours: null,
});
const hourly = (hours: number, lastDoneHours: number) => ({
  interval: { kind: "hours" as const, hours },
  lastDoneOn: null,
  lastDoneHours,
});

describe("next due date of a calendar plan", () => {
  it.each([
    { done: "2027-01-31", months: 1, due: "2027-02-28" },
    { done: "2028-01-31", months: 1, due: "2028-02-29" },
    { done: "2027-08-31", months: 6, due: "2028-02-29" },
    { done: "2026-08-31", months: 6, due: "2027-02-28" },
    { done: "2028-02-29", months: 12, due: "2029-02-28" },
    { done: "2026-12-15", months: 12, due: "2027-12-15" },
    { done: "2027-03-31", months: 3, due: "2027-06-30" },
    { done: "2027-11-30", months: 3, due: "2028-02-29" },
  ])("falls due $months months after $done on $due", ({ done, months, due }) => {
    const dueOn = nextDueOnByMonths(done, months);

    // End-of-month clamping, the project's rule for training cards (common practice); luxon 3 plus({ months }) agrees.
    expect(dueOn).toBe(due);
    expect(DateTime.fromISO(done, { zone: "UTC" }).plus({ months }).toISODate()).toBe(due);
  });

  it("is the same rule as a training card's validity", () => {
    const dates = ["2027-01-31", "2028-02-29", "2027-05-31", "2027-10-31"];

    const plans = dates.map((d) => nextDueOnByMonths(d, 7));

    expect(plans).toEqual(dates.map((d) => addCalendarMonths(d, 7))); // one clamping rule, not two
  });

  it("counts days until due from the site's today, so the 30- and 7-day marks land on the right days", () => {
    const plan = monthly(12, "2026-03-31");

    const at30 = planDue(plan, [], "2027-03-01");
    const at7 = planDue(plan, [], "2027-03-24");
    const on = planDue(plan, [], "2027-03-31");
    const after = planDue(plan, [], "2027-04-01");

    expect([at30.daysUntil, at30.state]).toEqual([30, "coming_due"]);
    expect([at7.daysUntil, at7.state]).toEqual([7, "due_soon"]);
    expect([on.daysUntil, on.state]).toEqual([0, "due_now"]);
    expect([after.daysUntil, after.state]).toEqual([-1, "overdue"]);
    expect(after.dueKey).toBe("date:2027-03-31");
  });
});

describe("running-hours plan", () => {
  it("falls due at the last service reading plus the interval, projected from the average use", () => {
    const readings = [
      { readOn: "2027-01-01", hours: 10_000 },
      { readOn: "2027-01-11", hours: 10_100 },
    ];

    const due = planDue(hourly(500, 10_000), readings, "2027-01-11");

    // 10 h a day over 10 days; 400 h still to run is 40 days (straight-line projection, common practice).
    expect(due).toMatchObject({
      dueHours: 10_500,
      currentHours: 10_100,
      dueOn: "2027-02-20",
      estimated: true,
      daysUntil: 40,
      dueKey: "hours:10500",
    });
  });

  it("is due now once the meter reaches the due reading, whatever the projection", () => {
    const readings = [{ readOn: "2027-01-05", hours: 10_600 }];

    const due = planDue(hourly(500, 10_000), readings, "2027-01-06");

    expect(due).toMatchObject({ state: "due_now", daysUntil: 0, estimated: false, currentHours: 10_600 });
  });

  it("projects no date from a single reading or readings under a week apart, and reminds only on hours then", () => {
    const one = planDue(hourly(500, 10_000), [{ readOn: "2027-01-05", hours: 10_100 }], "2027-01-06");
    const close = hoursPerDay([
      { readOn: "2027-01-01", hours: 10_000 },
      { readOn: "2027-01-04", hours: 10_030 },
    ]);

    expect(one).toMatchObject({ dueOn: null, daysUntil: null, state: "scheduled" });
    expect(close).toBeNull();
  });

  it("averages only the last year of readings", () => {
    const rate = hoursPerDay([
      { readOn: "2024-01-01", hours: 0 },
      { readOn: "2026-01-01", hours: 1_000 },
      { readOn: "2027-01-01", hours: 1_365 },
    ]);

    expect(rate).toBe(1); // 365 h over 2026's 365 days; the 2024 reading is left out
  });
});

describe("reminder thresholds", () => {
  it.each([
    { days: 45, expected: null },
    { days: 30, expected: 30 },
    { days: 8, expected: 30 },
    { days: 7, expected: 7 },
    { days: 5, expected: 7 },
    { days: -3, expected: 7 },
    { days: null, expected: null },
  ])("owes the $expected-day reminder at $days days", ({ days, expected }) => {
    const threshold = reminderThresholdFor(days);

    expect(threshold).toBe(expected);
  });
});

describe("maintenance request window", () => {
  it("asks for the two weeks before the due date, never starting in the past and at least a week long", () => {
    const ahead = maintenanceWindow("2027-03-31", "2027-03-01");
    const close = maintenanceWindow("2027-03-03", "2027-03-01");
    const late = maintenanceWindow("2027-02-20", "2027-03-01");
    const unknown = maintenanceWindow(null, "2027-03-01");

    expect(ahead).toEqual({ windowStart: "2027-03-17", windowEnd: "2027-03-31" });
    expect(close).toEqual({ windowStart: "2027-03-01", windowEnd: "2027-03-08" });
    expect(late).toEqual({ windowStart: "2027-03-01", windowEnd: "2027-03-08" });
    expect(unknown).toEqual({ windowStart: "2027-03-01", windowEnd: "2027-03-15" });
  });
});
