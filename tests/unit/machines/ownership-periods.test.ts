import { describe, expect, it } from "vitest";
import {
  canWriteHistory,
  carriedEntry,
  historyAccess,
  ownerAt,
  type OwnershipPeriod,
} from "../../../shared/machines/ownership-periods.ts";
import { allowedTransferActions } from "../../../shared/machines/transfers.ts";

const SELLER = 1;
const BUYER = 2;
const STRANGER = 3;
const sold = "2026-06-15T14:00:00.000Z";
// One machine: the seller from 2019 to the sale, the buyer since.
const periods: OwnershipPeriod[] = [
  { companyId: SELLER, from: "2019-06-03T12:00:00.000Z", to: sold },
  { companyId: BUYER, from: sold, to: null },
];

describe("service history across an ownership change", () => {
  it("puts the instant of the sale in the buyer's period, not the seller's (half-open periods, common practice)", () => {
    expect(ownerAt(periods, new Date(sold))).toBe(BUYER);
    expect(ownerAt(periods, new Date(Date.parse(sold) - 1))).toBe(SELLER);
    expect(ownerAt(periods, new Date("2018-01-01T00:00:00Z"))).toBeNull();
  });

  it("shows the buyer the seller's entries in their carried form and its own in full", () => {
    expect(historyAccess(BUYER, periods, new Date("2024-03-01T00:00:00Z"))).toBe("carried");
    expect(historyAccess(BUYER, periods, new Date("2027-01-01T00:00:00Z"))).toBe("own");
  });

  it("keeps the seller's own entries up to the sale and nothing after it", () => {
    expect(historyAccess(SELLER, periods, new Date("2024-03-01T00:00:00Z"))).toBe("own");
    expect(historyAccess(SELLER, periods, new Date(sold))).toBe("none");
    expect(canWriteHistory(SELLER, periods)).toBe(false);
    expect(canWriteHistory(BUYER, periods)).toBe(true);
  });

  it("shows a shop that never held the machine nothing", () => {
    expect(historyAccess(STRANGER, periods, new Date("2024-03-01T00:00:00Z"))).toBe("none");
  });

  it("carries the other owner's entries to a shop that buys its machine back", () => {
    const back: OwnershipPeriod[] = [
      { ...periods[0]! },
      { companyId: BUYER, from: sold, to: "2027-02-01T00:00:00.000Z" },
      { companyId: SELLER, from: "2027-02-01T00:00:00.000Z", to: null },
    ];

    expect(historyAccess(SELLER, back, new Date("2026-09-01T00:00:00Z"))).toBe("carried");
    expect(historyAccess(SELLER, back, new Date("2024-03-01T00:00:00Z"))).toBe("own");
    expect(historyAccess(BUYER, back, new Date("2027-03-01T00:00:00Z"))).toBe("none");
  });

  it("cuts an entry down to date, kind, company, work done and parts", () => {
    const entry = {
      occurredAt: "2024-03-01",
      kind: "repair",
      serviceCompanyName: "Kestrel Ridge Field Service",
      workDone: "Replaced the spindle encoder",
      parts: ["Encoder ENC-2048"],
      recordedByShop: false,
      prices: { hourlyRateCents: 14_500 },
      messages: ["Gate code 4471"],
      technicianName: "Rosalind Tennant",
    };

    expect(carriedEntry(entry)).toEqual({
      occurredAt: "2024-03-01",
      kind: "repair",
      serviceCompanyName: "Kestrel Ridge Field Service",
      workDone: "Replaced the spindle encoder",
      parts: ["Encoder ENC-2048"],
      recordedByShop: false,
    });
  });
});

describe("transfer lifecycle", () => {
  it("lets the receiver accept or decline and the seller withdraw only while it is open", () => {
    expect(allowedTransferActions("open", "receiver")).toEqual(["accept", "decline"]);
    expect(allowedTransferActions("open", "seller")).toEqual(["withdraw"]);
    for (const state of ["accepted", "declined", "withdrawn"] as const) {
      expect(allowedTransferActions(state, "receiver")).toEqual([]);
      expect(allowedTransferActions(state, "seller")).toEqual([]);
    }
  });
});
