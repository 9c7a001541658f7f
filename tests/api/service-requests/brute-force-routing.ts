import { QueryTypes } from "sequelize";
import { db } from "../../../server/db/sequelize.ts";
import { greatCircleDistanceKm } from "../../../shared/geo/great-circle-distance.ts";
import { DEFAULT_RADIUS_MILES } from "../../../shared/directory/schemas.ts";
import { milesToKm } from "../../../shared/geo/units.ts";
import type { RoutingCriteria } from "../../../server/service-requests/index.ts";

interface TechnicianFacts {
  id: number;
  company_id: number;
  company_kind: string;
  active: boolean;
  latitude: number | null;
  longitude: number | null;
  service_radius_km: number;
  technologies: string[];
  control_families: string[];
}
interface StandingFacts {
  technician_id: number;
  requirement_set_id: number | null;
  standing: string;
  earliest_lapse: Date | null;
}

/** Every technician and stored standing in the database, read plainly, for a filter written without SQL. */
export async function loadFacts() {
  const [technicians, standings] = await Promise.all([
    db().query<TechnicianFacts>(
      `SELECT t.id, t.company_id, c.kind AS company_kind, t.active, t.latitude, t.longitude, t.service_radius_km,
              t.technologies, t.control_families
         FROM technicians t JOIN companies c ON c.id = t.company_id`,
      { type: QueryTypes.SELECT },
    ),
    db().query<StandingFacts>(
      "SELECT technician_id, requirement_set_id, standing, earliest_lapse FROM technician_standings",
      { type: QueryTypes.SELECT },
    ),
  ]);
  return { technicians, standings };
}

type Facts = Awaited<ReturnType<typeof loadFacts>>;

/** Cleared at asOf for the set: listed in the stored standing (baseline and the set) and not yet past its lapse. */
export function clearedNow(
  facts: Facts,
  technician: TechnicianFacts,
  setId: number | null,
  asOf: Date,
): boolean {
  const listed = (set: number | null) =>
    facts.standings.some(
      (s) =>
        s.technician_id === technician.id &&
        s.requirement_set_id === set &&
        (s.standing === "cleared" || s.standing === "lapsing") &&
        (s.earliest_lapse === null || new Date(s.earliest_lapse).getTime() > asOf.getTime()),
    );
  return (
    technician.active &&
    technician.company_kind === "service" &&
    listed(null) &&
    (setId === null || listed(setId))
  );
}

/** The companies routing must invite, by the rule spelled out one technician at a time. */
export function bruteForceRouting(facts: Facts, criteria: RoutingCriteria): Set<number> {
  const reach = criteria.radiusKm ?? milesToKm(DEFAULT_RADIUS_MILES);
  const invited = new Set<number>();
  for (const t of facts.technicians) {
    if (!clearedNow(facts, t, criteria.requirementSetId, criteria.asOf)) continue;
    if (t.latitude === null || t.longitude === null) continue;
    if (!t.technologies.includes(criteria.technology)) continue;
    const family = criteria.controlFamily;
    if (family && !t.control_families.some((f) => f.toLowerCase() === family.toLowerCase())) continue;
    const km = greatCircleDistanceKm(
      { lat: t.latitude, lon: t.longitude },
      { lat: criteria.site.latitude, lon: criteria.site.longitude },
    );
    // Tolerance of a millimetre: SQL and JS round the haversine differently in the last bits.
    if (km > Math.min(t.service_radius_km, reach) + 1e-6) continue;
    invited.add(t.company_id);
  }
  return invited;
}
