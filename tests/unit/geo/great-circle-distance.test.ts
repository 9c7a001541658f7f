import fc from "fast-check";
import { getDistance } from "geolib";
import { describe, expect, it } from "vitest";
import {
  EARTH_MEAN_RADIUS_KM,
  centralAngleRadians,
  greatCircleDistanceKm,
  greatCircleDistanceMiles,
  isWithinReach,
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
