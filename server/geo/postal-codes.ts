import { createRequire } from "node:module";

// Offline US ZIP centroids (zipcodes, BSD) and ZIP -> IANA zone (zipcode-to-timezone): no network geocoder.
const require = createRequire(import.meta.url);
const zipcodes = require("zipcodes") as {
  lookup(
    zip: string,
  ): { zip: string; latitude: number; longitude: number; city: string; state: string } | undefined;
};
const zipZones = require("zipcode-to-timezone") as { lookup(zip: string): string | null | undefined };

export interface PostalPlace {
  postalCode: string;
  latitude: number;
  longitude: number;
  city: string;
  state: string;
  timeZone: string | null;
}

export function lookupPostalCode(postalCode: string): PostalPlace | undefined {
  const hit = zipcodes.lookup(postalCode);
  if (!hit) return undefined;
  return {
    postalCode: hit.zip,
    latitude: hit.latitude,
    longitude: hit.longitude,
    city: hit.city,
    state: hit.state,
    timeZone: zipZones.lookup(postalCode) ?? null,
  };
}
