import fc from "fast-check";
import { getDistance } from "geolib";
import { describe, expect, it } from "vitest";
import {
  EARTH_MEAN_RADIUS_KM,
  centralAngleRadians,
  greatCircleDistanceKm,
  greatCircleDistanceMiles,
  isWithinReach,
  unitChordForKm,
} from "../../../shared/geo/great-circle-distance.ts";

// Ed Williams, Aviation Formulary V1.46, worked example (east longitude positive here, so west is negative).
const LAX = { lat: 33 + 57 / 60, lon: -(118 + 24 / 60) };
const JFK = { lat: 40 + 38 / 60, lon: -(73 + 47 / 60) };
const CHICAGO = { lat: 41.8781, lon: -87.6298 };
const MILWAUKEE = { lat: 43.0389, lon: -87.9065 };
// geolib 3.3.14 uses the spherical law of cosines on a sphere of 6,378,137 m (its earthRadius constant).
const GEOLIB_EARTH_RADIUS_M = 6_378_137;

describe("great-circle distance", () => {
  it("gives the Aviation Formulary's LAX-JFK central angle", () => {
    const angle = centralAngleRadians(LAX, JFK);

    expect(angle).toBeCloseTo(0.623585, 6); // Aviation Formulary V1.46 (Ed Williams), worked example LAX-JFK: d = 0.623585 rad
    expect(Math.round((angle * 10800) / Math.PI)).toBe(2144); // Aviation Formulary: 2144 nm (arc-minutes)
  });

  it("gives LAX-JFK in km and statute miles on the IUGG mean radius", () => {
    const km = greatCircleDistanceKm(LAX, JFK);
    const miles = greatCircleDistanceMiles(LAX, JFK);

    expect(EARTH_MEAN_RADIUS_KM).toBe(6371.0088); // IUGG mean radius R1 = (2a + b) / 3 of GRS80
    expect(km).toBeCloseTo(3972.863, 2); // haversine on the Aviation Formulary's LAX-JFK points, R = 6371.0088 km
    expect(miles).toBeCloseTo(2468.62, 2); // haversine on the Aviation Formulary's LAX-JFK points, R = 6371.0088 km
  });

  it("gives one degree of latitude as 111.1951 km", () => {
    const km = greatCircleDistanceKm({ lat: 10, lon: 20 }, { lat: 11, lon: 20 });

    expect(km).toBeCloseTo(111.1951, 4); // haversine, 1° of latitude at R = 6371.0088 km (computed: R·π/180)
  });

  it("gives Chicago-Milwaukee as 131.056 km", () => {
    const km = greatCircleDistanceKm(CHICAGO, MILWAUKEE);

    expect(km).toBeCloseTo(131.056, 2); // haversine, Chicago-Milwaukee at R = 6371.0088 km (computed in node)
    expect(greatCircleDistanceMiles(CHICAGO, MILWAUKEE)).toBeCloseTo(81.43, 2); // the same, in statute miles of 1.609344 km
  });

  it("is zero for the same point and unchanged when both longitudes change sign", () => {
    const same = greatCircleDistanceKm(CHICAGO, CHICAGO);
    const mirrored = greatCircleDistanceKm({ lat: LAX.lat, lon: -LAX.lon }, { lat: JFK.lat, lon: -JFK.lon });

    expect(same).toBe(0); // haversine identity
    expect(mirrored).toBeCloseTo(greatCircleDistanceKm(LAX, JFK), 9); // haversine identity
  });

  it("agrees with geolib on random pairs of points", () => {
    const point = fc.record({
      lat: fc.double({ min: -89.9, max: 89.9, noNaN: true }),
      lon: fc.double({ min: -180, max: 180, noNaN: true }),
    });

    fc.assert(
      fc.property(point, point, (a, b) => {
        const ours = centralAngleRadians(a, b) * GEOLIB_EARTH_RADIUS_M;

        const reference = getDistance(
          { latitude: a.lat, longitude: a.lon },
          { latitude: b.lat, longitude: b.lon },
          0.001,
        );

        // The law of cosines loses about 0.1 m near 0 and pi radians; haversine does not.
        expect(Math.abs(ours - reference)).toBeLessThan(0.5);
      }),
      { numRuns: 2000 },
    );
  });

  it("offers a technician only inside both the service radius and the search radius", () => {
    const inside = isWithinReach(40, 50, 60);
    const outsideService = isWithinReach(55, 50, 60);
    const outsideSearch = isWithinReach(45, 50, 40);

    expect(inside).toBe(true);
    expect(outsideService).toBe(false);
    expect(outsideSearch).toBe(false);
  });
});

describe("the chord a spatial index prefilters by", () => {
  // Elementary geometry: a chord of a unit circle spanning the central angle θ is 2·sin(θ/2); 60° spans a side of the
  // inscribed regular hexagon, exactly one radius long, and the antipode spans the diameter.
  it("is 0 at the point, 1 at a 60-degree arc and 2 at the antipode, and never shrinks past it", () => {
    const arcKm = (degrees: number) => (EARTH_MEAN_RADIUS_KM * degrees * Math.PI) / 180;
    expect(unitChordForKm(0)).toBe(0);
    expect(unitChordForKm(arcKm(60))).toBeCloseTo(1, 12);
    expect(unitChordForKm(arcKm(180))).toBeCloseTo(2, 12);
    expect(unitChordForKm(arcKm(270))).toBeCloseTo(2, 12);
  });

  it("holds every point within the distance: the straight line between two places never exceeds it", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -89, max: 89, noNaN: true }),
        fc.double({ min: -179, max: 179, noNaN: true }),
        fc.double({ min: -89, max: 89, noNaN: true }),
        fc.double({ min: -179, max: 179, noNaN: true }),
        (lat1, lon1, lat2, lon2) => {
          const point = (lat: number, lon: number) => {
            const [φ, λ] = [(lat * Math.PI) / 180, (lon * Math.PI) / 180];
            return [Math.cos(φ) * Math.cos(λ), Math.cos(φ) * Math.sin(λ), Math.sin(φ)];
          };
          const [a, b] = [point(lat1, lon1), point(lat2, lon2)];
          const straight = Math.hypot(a[0]! - b[0]!, a[1]! - b[1]!, a[2]! - b[2]!);
          const km = greatCircleDistanceKm({ lat: lat1, lon: lon1 }, { lat: lat2, lon: lon2 });
          // The cube's half-side is this chord plus 1e-9 in SQL; each axis difference is at most the straight line.
          expect(straight).toBeLessThanOrEqual(unitChordForKm(km) + 1e-9);
        },
      ),
    );
  });
});
