import { createRequire } from "node:module";
import { describe, expect, it } from "vitest";
import { lookupPostalCode } from "../../../server/geo/postal-codes.ts";

const packageLookup = createRequire(import.meta.url)("zipcodes") as {
  codes: Record<string, { zip: string; latitude: number; longitude: number; city: string; state: string }>;
  lookup(
    zip: string,
  ): { zip: string; latitude: number; longitude: number; city: string; state: string } | undefined;
};

describe("ZIP table read as JSON", () => {
  it("answers every code exactly as the zipcodes package's own lookup", () => {
    const keys = Object.keys(packageLookup.codes);
    expect(keys.length).toBeGreaterThan(40_000);
    for (const key of keys) {
      const ours = lookupPostalCode(key);
      const theirs = packageLookup.lookup(key)!;
      expect(ours && [ours.postalCode, ours.latitude, ours.longitude, ours.city, ours.state]).toEqual([
        theirs.zip,
        theirs.latitude,
        theirs.longitude,
        theirs.city,
        theirs.state,
      ]);
    }
  });

  it("places 60601 in Chicago, IL on Central time and knows no 00000 (USPS ZIP directory, from memory)", () => {
    expect(lookupPostalCode("60601")).toMatchObject({
      city: "Chicago",
      state: "IL",
      timeZone: "America/Chicago",
    });
    expect(lookupPostalCode("00000")).toBeUndefined();
  });

  it("looks a Canadian postal code up by its forward sortation area, as the package does", () => {
    expect(lookupPostalCode("T0A 1A0")?.postalCode).toBe(packageLookup.lookup("T0A 1A0")?.zip);
  });
});
