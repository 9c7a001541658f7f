import { greatCircleDistanceKm } from "../../../shared/geo/great-circle-distance.ts";
import { milesToKm } from "../../../shared/geo/units.ts";
import type { DirectoryWorld, WorldTechnician } from "../../fixtures/build-directory-world.ts";

/** A directory search as the property test draws it; `requirementSet` and `radiusMiles` use the world's set and site. */
export interface DrawnFilters {
  credentialTypes?: readonly string[];
  oemBuilder?: string;
  controlFamily?: string;
  minOemLevel?: number;
  technology?: string;
  minEachOccurrence?: number;
  minAggregate?: number;
  minAutoCsl?: number;
  requirementSet?: boolean;
  radiusMiles?: number;
  minRating?: number;
  q?: string;
}

function holds(
  t: WorldTechnician,
  typeCode: string,
  now: Date,
  test: (fields: Record<string, unknown>) => boolean = () => true,
): boolean {
  return t.credentials.some(
    (c) =>
      c.typeCode === typeCode &&
      c.state === "verified" &&
      (c.lapsesAt === null || c.lapsesAt > now) &&
      test(c.fields),
  );
}

const limit = (fields: Record<string, unknown>, name: string) =>
  ((fields.limits as Record<string, number> | undefined) ?? {})[name] ?? -1;
const same = (a: unknown, b: string) => typeof a === "string" && a.trim().toLowerCase() === b.toLowerCase();

/** The directory's rules written plainly over in-memory rows, independent of the SQL. */
export function bruteForceDirectory(world: DirectoryWorld, f: DrawnFilters, now: Date): number[] {
  return (
    world.technicians
      .filter((t) => t.active && (t.baseline === "cleared" || t.baseline === "lapsing"))
      .filter((t) => (f.credentialTypes ?? []).every((code) => holds(t, code, now)))
      .filter((t) =>
        f.oemBuilder === undefined && f.controlFamily === undefined && f.minOemLevel === undefined
          ? true
          : holds(
              t,
              "oem_training",
              now,
              (x) =>
                (f.oemBuilder === undefined || same(x.builder, f.oemBuilder)) &&
                (f.controlFamily === undefined || same(x.controlFamily, f.controlFamily)) &&
                (f.minOemLevel === undefined || Number(x.level) >= f.minOemLevel),
            ),
      )
      .filter((t) => f.technology === undefined || t.technologies.includes(f.technology))
      .filter((t) =>
        f.minEachOccurrence === undefined && f.minAggregate === undefined
          ? true
          : holds(
              t,
              "general_liability",
              now,
              (x) =>
                (f.minEachOccurrence === undefined || limit(x, "eachOccurrence") >= f.minEachOccurrence) &&
                (f.minAggregate === undefined || limit(x, "generalAggregate") >= f.minAggregate),
            ),
      )
      .filter(
        (t) =>
          f.minAutoCsl === undefined ||
          holds(t, "auto_liability", now, (x) => limit(x, "combinedSingleLimit") >= f.minAutoCsl!),
      )
      // The world's set belongs to its site, so choosing the site applies that set too.
      .filter(
        (t) =>
          (!f.requirementSet && f.radiusMiles === undefined) ||
          t.setStanding === "cleared" ||
          t.setStanding === "lapsing",
      )
      .filter((t) => {
        if (f.radiusMiles === undefined) return true;
        const km = greatCircleDistanceKm(
          { lat: world.site.latitude, lon: world.site.longitude },
          { lat: t.latitude, lon: t.longitude },
        );
        return km <= Math.min(t.serviceRadiusKm, milesToKm(f.radiusMiles));
      })
      .filter(
        (t) => f.minRating === undefined || (t.ratingCount > 0 && t.starSum / t.ratingCount >= f.minRating),
      )
      .filter(
        (t) => f.q === undefined || `${t.name}\n${t.companyName}`.toLowerCase().includes(f.q.toLowerCase()),
      )
      .map((t) => t.id)
      .sort((a, b) => a - b)
  );
}

/** The same search as a query string for GET /api/directory. */
export function toQuery(world: DirectoryWorld, f: DrawnFilters): Record<string, string> {
  const q: Record<string, string> = {};
  if (f.credentialTypes?.length) q.credentialTypes = f.credentialTypes.join(",");
  if (f.oemBuilder !== undefined) q.oemBuilder = f.oemBuilder;
  if (f.controlFamily !== undefined) q.controlFamily = f.controlFamily;
  if (f.minOemLevel !== undefined) q.minOemLevel = String(f.minOemLevel);
  if (f.technology !== undefined) q.technology = f.technology;
  if (f.minEachOccurrence !== undefined) q.minEachOccurrence = String(f.minEachOccurrence);
  if (f.minAggregate !== undefined) q.minAggregate = String(f.minAggregate);
  if (f.minAutoCsl !== undefined) q.minAutoCsl = String(f.minAutoCsl);
  if (f.requirementSet) q.requirementSetId = String(world.requirementSetId);
  if (f.radiusMiles !== undefined) {
    q.siteId = String(world.site.id);
    q.radiusMiles = String(f.radiusMiles);
  }
  if (f.minRating !== undefined) q.minRating = String(f.minRating);
  if (f.q !== undefined) q.q = f.q;
  return q;
}
