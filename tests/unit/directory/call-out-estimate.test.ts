import { describe, expect, it } from "vitest";
import { estimateCallOut } from "../../../shared/directory/call-out-estimate.ts";
import { estimateDriveHours, estimateRoadMiles } from "../../../shared/directory/drive-time.ts";

const rates = { hourlyRateCents: 14_000, travelRateCents: 10_000, mileageRateCents: 70 };

describe("call-out estimate", () => {
  it("bills 200.00 of travel before work starts and 564.00 in all for a technician 1 h and 60 mi away", () => {
    const estimate = estimateCallOut({ ...rates, oneWayMiles: 60, oneWayHours: 1 });

    expect(estimate.travelCents).toBe(20_000); // common practice: 2 × 1 h × 100, portal to portal
    expect(estimate.mileageCents).toBe(8_400); // common practice worked example: 120 mi × 0.70
    expect(estimate.labourCents).toBe(28_000); // common practice worked example: 2 h × 140
    expect(estimate.totalCents).toBe(56_400); // common practice worked example
  });

  it("costs 567.00 at the 72.5 cents a mile rate", () => {
    const estimate = estimateCallOut({ ...rates, mileageRateCents: 72.5, oneWayMiles: 60, oneWayHours: 1 });

    expect(estimate.mileageCents).toBe(8_700); // common practice worked example
    expect(estimate.totalCents).toBe(56_700); // common practice worked example
  });

  it("estimates the drive time from the miles at the stated average speed when none is given", () => {
    const estimate = estimateCallOut({ ...rates, oneWayMiles: 60, drive: { averageSpeedMph: 60 } });

    expect(estimate.travelCents).toBe(20_000); // 60 mi at 60 mph is 1 h each way (our assumption made explicit)
  });

  it("rounds each line once to whole cents so the total adds up", () => {
    const estimate = estimateCallOut({
      ...rates,
      oneWayMiles: 10.333,
      oneWayHours: 0.3333,
      onSiteHours: 1.25,
    });

    expect(estimate.travelCents).toBe(6_666);
    expect(estimate.mileageCents).toBe(1_447);
    expect(estimate.labourCents).toBe(17_500);
    expect(estimate.totalCents).toBe(estimate.travelCents + estimate.labourCents + estimate.mileageCents);
  });

  it("turns straight-line miles into road miles and hours with the stated assumptions", () => {
    const roadMiles = estimateRoadMiles(100, { roadFactor: 1.2 });
    const hours = estimateDriveHours(roadMiles, { averageSpeedMph: 40 });

    expect(roadMiles).toBeCloseTo(120, 9);
    expect(hours).toBeCloseTo(3, 9);
  });
});
