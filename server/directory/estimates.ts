import { estimateCallOut } from "../../shared/directory/call-out-estimate.ts";
import {
  DEFAULT_AVERAGE_SPEED_MPH,
  DEFAULT_ROAD_FACTOR,
  estimateDriveHours,
  estimateRoadMiles,
} from "../../shared/directory/drive-time.ts";
import type { DirectoryAssumptionsDto } from "../../shared/directory/directory-shapes.ts";
import { EARTH_MEAN_RADIUS_KM, kmToMiles } from "../../shared/geo/great-circle-distance.ts";
import { DEFAULT_PRIOR, rankingScore } from "../../shared/ranking/rating-score.ts";

export const SCORE_SOURCE =
  `Bayesian average (C·m + Σ stars) / (C + n) with prior mean m = ${DEFAULT_PRIOR.mean} and weight C = ${DEFAULT_PRIOR.weight} ` +
  "pseudo-reviews, the form of the IMDb weighted rating (shared/ranking/rating-score.ts)";

const round = (value: number, digits: number) => Number(value.toFixed(digits));

export function assumptions(onSiteHours: number): DirectoryAssumptionsDto {
  return {
    earthRadiusKm: EARTH_MEAN_RADIUS_KM,
    roadFactor: DEFAULT_ROAD_FACTOR,
    averageSpeedMph: DEFAULT_AVERAGE_SPEED_MPH,
    onSiteHours,
  };
}

/** Distance, drive time and call-out estimate for one straight-line distance, all from the shared code. */
export function estimateTrip(
  distanceKm: number,
  rates: { hourlyRateCents: number; travelRateCents: number; mileageRateCents: number },
  onSiteHours: number,
) {
  const straightMiles = kmToMiles(distanceKm);
  const roadMiles = estimateRoadMiles(straightMiles);
  const driveHours = estimateDriveHours(roadMiles);
  const callOut = estimateCallOut({ oneWayMiles: roadMiles, oneWayHours: driveHours, onSiteHours, ...rates });
  return {
    distanceKm: round(distanceKm, 2),
    distanceMiles: round(straightMiles, 2),
    roadMiles: round(roadMiles, 1),
    driveHours: round(driveHours, 2),
    callOut,
  };
}

export function ratingSummary(count: number, sumStars: number) {
  return {
    count,
    average: count > 0 ? round(sumStars / count, 2) : null,
    score: round(rankingScore({ count, sumStars }), 4),
  };
}
