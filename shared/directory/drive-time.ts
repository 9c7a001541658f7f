/**
 * Assumption: road distance ≈ straight-line distance × 1.3. Published US circuity factors average about 1.2
 * (from memory); 1.3 leans long so an estimate rarely undershoots. Configurable per call.
 */
export const DEFAULT_ROAD_FACTOR = 1.3;
/** Assumption: 45 mph door to door, mixing highway and local roads to an industrial site. Configurable per call. */
export const DEFAULT_AVERAGE_SPEED_MPH = 45;

export interface DriveAssumptions {
  roadFactor?: number | undefined;
  averageSpeedMph?: number | undefined;
}

/** Estimated one-way road miles from a straight-line distance. */
export function estimateRoadMiles(straightLineMiles: number, assumptions: DriveAssumptions = {}): number {
  return straightLineMiles * (assumptions.roadFactor ?? DEFAULT_ROAD_FACTOR);
}

/** Estimated one-way drive hours for a road distance at the assumed average speed. */
export function estimateDriveHours(roadMiles: number, assumptions: DriveAssumptions = {}): number {
  const speed = assumptions.averageSpeedMph ?? DEFAULT_AVERAGE_SPEED_MPH;
  if (!(speed > 0)) throw new RangeError("Average speed must be positive");
  return roadMiles / speed;
}
