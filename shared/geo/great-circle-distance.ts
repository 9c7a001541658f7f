/** IUGG mean radius R1 = (2a + b) / 3 of GRS80 = 6,371,008.7714 m (GRS80: a = 6,378,137 m, 1/f = 298.257222101). */
export const EARTH_MEAN_RADIUS_KM = 6371.0088;
import { kmToMiles } from "./units.ts";

export { KM_PER_STATUTE_MILE, kmToMiles, milesToKm } from "./units.ts";

export interface LatLon {
  /** Degrees, north positive. */
  lat: number;
  /** Degrees, east positive. */
  lon: number;
}

const toRadians = (degrees: number): number => (degrees * Math.PI) / 180;

/**
 * Central angle between two points, in radians, by the haversine formula, which stays accurate for short distances
 * where the spherical law of cosines loses precision (Ed Williams, Aviation Formulary V1.46).
 */
export function centralAngleRadians(from: LatLon, to: LatLon): number {
  const phi1 = toRadians(from.lat);
  const phi2 = toRadians(to.lat);
  const halfDeltaPhi = (phi2 - phi1) / 2;
  const halfDeltaLambda = toRadians(to.lon - from.lon) / 2;
  const a = Math.sin(halfDeltaPhi) ** 2 + Math.cos(phi1) * Math.cos(phi2) * Math.sin(halfDeltaLambda) ** 2;
  // Rounding can push a a hair above 1 for antipodal points.
  return 2 * Math.asin(Math.sqrt(Math.min(1, a)));
}

/** Straight-line (great-circle) distance on a sphere of the mean Earth radius; not a driving distance. */
export function greatCircleDistanceKm(from: LatLon, to: LatLon): number {
  return centralAngleRadians(from, to) * EARTH_MEAN_RADIUS_KM;
}

export function greatCircleDistanceMiles(from: LatLon, to: LatLon): number {
  return kmToMiles(greatCircleDistanceKm(from, to));
}

/** A technician is offered only inside their own service radius and the buyer's search radius. */
export function isWithinReach(
  distanceMiles: number,
  serviceRadiusMiles: number,
  searchRadiusMiles: number,
): boolean {
  return distanceMiles <= Math.min(serviceRadiusMiles, searchRadiusMiles);
}

/**
 * The straight-line distance through the unit sphere between two points `distanceKm` apart on the surface
 * (chord = 2·sin(θ/2), θ the central angle): the half-side of a cube that holds every point within that distance, so a
 * spatial index can drop far points before the exact great-circle test.
 */
export function unitChordForKm(distanceKm: number): number {
  return 2 * Math.sin(Math.min(Math.PI, distanceKm / EARTH_MEAN_RADIUS_KM) / 2);
}
