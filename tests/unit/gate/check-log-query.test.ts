import { describe, expect, it } from "vitest";
import { gateCheckLogQuerySchema, isKnownTimeZone } from "../../../shared/gate/check-log.ts";

describe("gate check log filters", () => {
  it("takes zones of the IANA time zone database and refuses made-up ones", () => {
    expect(isKnownTimeZone("America/Chicago")).toBe(true);
    expect(isKnownTimeZone("Pacific/Honolulu")).toBe(true);
    expect(isKnownTimeZone("Mars/Olympus")).toBe(false);
  });

  it("takes a one-day range and refuses one that ends before it starts", () => {
    expect(gateCheckLogQuerySchema.safeParse({ from: "2027-03-01", to: "2027-03-01" }).success).toBe(true);
    const backwards = gateCheckLogQuerySchema.safeParse({ from: "2027-03-02", to: "2027-03-01" });

    expect(backwards.success).toBe(false);
    expect(backwards.error?.issues[0]?.path).toEqual(["from"]);
  });

  it("refuses a day that is not on the calendar", () => {
    // 2027 is not a leap year (Gregorian rule, ISO 8601).
    expect(gateCheckLogQuerySchema.safeParse({ from: "2027-02-29" }).success).toBe(false);
  });
});
