import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";

// Offline US ZIP centroids (zipcodes, BSD) and ZIP -> IANA zone (zipcode-to-timezone): no network geocoder.
const require = createRequire(import.meta.url);

interface ZipHit {
  zip: string;
  latitude: number;
  longitude: number;
  city: string;
  state: string;
}

/**
 * The package's tables are one 5 MB object literal per country; compiling them as JavaScript left about 90 MB of
 * parser memory in the server process for good. The same literal is JSON, so it is parsed as JSON (about 40 MB) on
 * the first look-up, keeping only the fields used. If the package ever changes that layout, its own module is used.
 */
let table: Map<string, ZipHit> | undefined;
function zipTable(): Map<string, ZipHit> {
  if (table) return table;
  const dir = path.dirname(require.resolve("zipcodes"));
  const loaded = new Map<string, ZipHit>();
  try {
    for (const file of ["codes.js", "codesCanada.js"]) {
      const literal = /^exports\.codes = (\{.*?\});\s*$/m.exec(
        readFileSync(path.join(dir, file), "utf8"),
      )?.[1];
      if (!literal) throw new Error(`zipcodes/${file}: layout changed`);
      for (const [key, c] of Object.entries(JSON.parse(literal) as Record<string, ZipHit>))
        loaded.set(key, {
          zip: c.zip,
          latitude: c.latitude,
          longitude: c.longitude,
          city: c.city,
          state: c.state,
        });
    }
  } catch {
    const codes = (require("zipcodes") as { codes: Record<string, ZipHit> }).codes;
    for (const [key, c] of Object.entries(codes)) loaded.set(key, c);
  }
  table = loaded;
  return table;
}

// As the package's own lookup: a code starting with a letter (Canada) is looked up by its first three characters.
const zipcodes = {
  lookup(zip: string): ZipHit | undefined {
    const key = /^[0-9]/.test(zip) ? zip : zip.slice(0, 3);
    return zipTable().get(key);
  },
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
