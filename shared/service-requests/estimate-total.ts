import { estimateCallOut } from "../directory/call-out-estimate.ts";
import { estimateDriveHours, estimateRoadMiles } from "../directory/drive-time.ts";
import { kmToMiles } from "../geo/great-circle-distance.ts";
import type { EstimatePart, EstimateTotalDto } from "./schemas.ts";

export interface EstimateTotalInput {
  /** Straight-line distance from the technician's base to the site. */
  distanceKm: number;
  hourlyRateCents: number;
  travelRateCents: number;
  mileageRateCents: number;
  onSiteHours: number;
  parts: readonly EstimatePart[];
}

/**
 * The call-out (travel both ways, labour on site, mileage both ways) from the shared computation, plus the parts with a
 * known price. Whole cents, the total is the sum of the lines, and it is before tax: sales tax depends on the state
 * and on what is labour and what is parts, which the shop's own books settle.
 */
export function estimateTotal(input: EstimateTotalInput): EstimateTotalDto & {
  roadMiles: number;
  driveHours: number;
} {
  const roadMiles = estimateRoadMiles(kmToMiles(input.distanceKm));
  const driveHours = estimateDriveHours(roadMiles);
  const callOut = estimateCallOut({
    oneWayMiles: roadMiles,
    oneWayHours: driveHours,
    onSiteHours: input.onSiteHours,
    hourlyRateCents: input.hourlyRateCents,
    travelRateCents: input.travelRateCents,
    mileageRateCents: input.mileageRateCents,
  });
  const priced = input.parts.filter((p) => p.unitPriceCents !== null);
  const partsCents = priced.reduce((sum, p) => sum + p.quantity * (p.unitPriceCents ?? 0), 0);
  return {
    travelCents: callOut.travelCents,
    labourCents: callOut.labourCents,
    mileageCents: callOut.mileageCents,
    partsCents,
    totalCents: callOut.totalCents + partsCents,
    unpricedParts: input.parts.length - priced.length,
    basis: "before tax",
    roadMiles,
    driveHours,
  };
}
