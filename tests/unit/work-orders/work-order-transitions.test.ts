import { describe, expect, it } from "vitest";
import { workOrderStatuses } from "../../../shared/work-orders/schemas.ts";
import {
  availableActions,
  canMove,
  canSendAgain,
  seesOnSiteDetails,
} from "../../../shared/work-orders/work-order-transitions.ts";

// Common practice for a dispatch lifecycle: a request is answered by the service side, the shop signs the work off.
describe("the work order's moves", () => {
  it("offers each side only its own next steps", () => {
    expect(availableActions("requested", "service")).toEqual(["accept", "decline"]);
    expect(availableActions("requested", "shop")).toEqual(["cancel"]);
    expect(availableActions("accepted", "shop")).toEqual(["cancel"]);
    expect(availableActions("accepted", "service")).toEqual(["complete"]);
    expect(availableActions("completed", "shop")).toEqual(["confirm", "dispute"]);
    expect(availableActions("disputed", "shop")).toEqual(["confirm"]);
    expect(availableActions("disputed", "service")).toEqual(["complete"]);
  });

  it("leaves nothing to do on a confirmed, cancelled or declined work order", () => {
    for (const status of ["confirmed", "cancelled", "declined"] as const) {
      expect(availableActions(status, "shop")).toEqual([]);
      expect(availableActions(status, "service")).toEqual([]);
    }
  });

  it.each([
    ["cancel", "completed"],
    ["cancel", "confirmed"],
    ["cancel", "declined"],
    ["dispute", "accepted"],
    ["dispute", "disputed"],
    ["dispute", "confirmed"],
    ["accept", "declined"],
    ["accept", "cancelled"],
    ["complete", "requested"],
    ["confirm", "accepted"],
  ] as const)("forbids %s from %s", (action, status) => {
    expect(canMove(action, status)).toBe(false);
  });

  it("lets every status but the end states be left by some move", () => {
    const ends = workOrderStatuses.filter(
      (s) => availableActions(s, "shop").length + availableActions(s, "service").length === 0,
    );
    expect(ends.sort()).toEqual(["cancelled", "confirmed", "declined"]);
  });

  it("lets only the shop send a declined job on", () => {
    expect(canSendAgain("declined", "shop")).toBe(true);
    expect(canSendAgain("declined", "service")).toBe(false);
    expect(canSendAgain("requested", "shop")).toBe(false);
    expect(canSendAgain("cancelled", "shop")).toBe(false);
  });

  it("shows the service side the on-site details only once it has accepted", () => {
    expect(seesOnSiteDetails("service", null)).toBe(false);
    expect(seesOnSiteDetails("service", "2027-03-01T12:00:00.000Z")).toBe(true);
    expect(seesOnSiteDetails("shop", null)).toBe(true);
  });
});
