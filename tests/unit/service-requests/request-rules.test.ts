import { describe, expect, it } from "vitest";
import { companyActions, shopActions } from "../../../shared/service-requests/request-transitions.ts";
import { medianResponseMinutes, answersInWindow } from "../../../shared/service-requests/response-time.ts";
import { estimateTotal } from "../../../shared/service-requests/estimate-total.ts";

const at = (iso: string) => new Date(iso);

describe("request lifecycle table", () => {
  it("lets the shop accept or cancel only an open request", () => {
    expect(shopActions("open").sort()).toEqual(["accept", "cancel"]);
    expect(shopActions("decided")).toEqual([]);
    expect(shopActions("expired")).toEqual([]);
  });

  it("lets a company revise or withdraw an active estimate, and nothing once decided", () => {
    expect(companyActions("open", null, null).sort()).toEqual(["estimate", "message", "pass"]);
    expect(companyActions("open", "estimate", "active").sort()).toEqual(["message", "revise", "withdraw"]);
    expect(companyActions("open", "estimate", "withdrawn").sort()).toEqual(["estimate", "message"]);
    expect(companyActions("decided", "estimate", "accepted")).toEqual([]);
  });
});

describe("typical response time", () => {
  it("is the median minutes from invitation to first answer", () => {
    const answers = [10, 30, 240].map((m) => ({
      invitedAt: at("2026-12-01T12:00:00Z"),
      firstAnswerAt: new Date(at("2026-12-01T12:00:00Z").getTime() + m * 60_000),
    }));

    expect(medianResponseMinutes(answers)).toBe(30);
    expect(medianResponseMinutes(answers.slice(0, 2))).toBe(20);
    expect(medianResponseMinutes([])).toBeNull();
  });

  it("counts only answered invitations of the last 90 days", () => {
    const asOf = at("2026-12-02T00:00:00Z");
    const rows = [
      { invitedAt: at("2026-11-30T00:00:00Z"), firstAnswerAt: at("2026-11-30T01:00:00Z") },
      { invitedAt: at("2026-08-01T00:00:00Z"), firstAnswerAt: at("2026-08-01T00:05:00Z") },
      { invitedAt: at("2026-11-30T00:00:00Z"), firstAnswerAt: null },
    ];

    expect(answersInWindow(rows, asOf)).toHaveLength(1);
  });
});

describe("estimate total", () => {
  it("adds travel, labour, mileage and priced parts in whole cents, before tax", () => {
    // 100 km straight line = 62.14 mi; x1.3 road = 80.78 mi; at 45 mph = 1.795 h each way (common practice assumptions)
    const total = estimateTotal({
      distanceKm: 100,
      hourlyRateCents: 15_000,
      travelRateCents: 10_000,
      mileageRateCents: 73,
      onSiteHours: 3,
      parts: [
        { description: "Spindle encoder", quantity: 1, unitPriceCents: 84_000 },
        { description: "Way wiper kit", quantity: 2, unitPriceCents: null },
      ],
    });

    expect(total.labourCents).toBe(45_000);
    expect(total.travelCents).toBe(Math.round(2 * total.driveHours * 10_000));
    expect(total.mileageCents).toBe(Math.round(2 * total.roadMiles * 73));
    expect(total.partsCents).toBe(84_000);
    expect(total.unpricedParts).toBe(1);
    expect(total.totalCents).toBe(
      total.travelCents + total.labourCents + total.mileageCents + total.partsCents,
    );
    expect(total.basis).toBe("before tax");
  });
});
