import { estimateDriveHours, type DriveAssumptions } from "./drive-time.ts";

/** Common practice: a call-out books at least a couple of hours on site. */
export const DEFAULT_ON_SITE_HOURS = 2;

export interface CallOutInput {
  /** One-way road miles from the technician's base to the site. */
  oneWayMiles: number;
  /** One-way drive hours; estimated from the miles and `drive` assumptions when absent. */
  oneWayHours?: number | undefined;
  onSiteHours?: number | undefined;
  hourlyRateCents: number;
  travelRateCents: number;
  /** May carry a fraction of a cent (e.g. 72.5 cents/mi, the IRS 2026 rate). */
  mileageRateCents: number;
  drive?: DriveAssumptions | undefined;
}

export interface CallOutEstimate {
  travelCents: number;
  labourCents: number;
  mileageCents: number;
  totalCents: number;
}

/**
 * Travel is billed portal to portal, both ways, at its own rate; labour on site at the hourly rate; mileage both ways
 * (common practice). Each line is computed exactly and rounded once to whole cents, and the total is the
 * sum of the printed lines so the estimate always adds up.
 */
export function estimateCallOut(input: CallOutInput): CallOutEstimate {
  const oneWayHours = input.oneWayHours ?? estimateDriveHours(input.oneWayMiles, input.drive);
  const travelCents = Math.round(2 * oneWayHours * input.travelRateCents);
  const labourCents = Math.round((input.onSiteHours ?? DEFAULT_ON_SITE_HOURS) * input.hourlyRateCents);
  const mileageCents = Math.round(2 * input.oneWayMiles * input.mileageRateCents);
  return { travelCents, labourCents, mileageCents, totalCents: travelCents + labourCents + mileageCents };
}
