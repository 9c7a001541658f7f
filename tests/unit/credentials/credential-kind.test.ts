import { describe, expect, it } from "vitest";
import { awaitsHolder, type FollowUpCandidate } from "../../../shared/credentials/credential-kind.ts";

let id = 1;
const card = (over: Partial<FollowUpCandidate>): FollowUpCandidate => ({
  id: id++,
  typeCode: "arc_flash",
  companyId: 1,
  technicianId: 7,
  fields: {},
  state: "verified",
  submittedAt: "2026-11-01T12:00:00Z",
  ...over,
});

// Common practice of the office's overview: a returned or lapsed credential stays on the list until a newer one of
// the same kind is sent; builder training is held per builder and control family.
describe("a returned or lapsed credential waits for its holder until a newer one of the same kind is sent", () => {
  it("keeps a return open until any newer upload of the same type and holder arrives", () => {
    const returned = card({ state: "returned", submittedAt: "2026-11-01T12:00:00Z" });
    expect(awaitsHolder(returned, [returned])).toBe(true);
    const older = card({ state: "submitted", submittedAt: "2026-10-01T12:00:00Z" });
    expect(awaitsHolder(returned, [returned, older])).toBe(true);
    const newer = card({ state: "returned", submittedAt: "2026-11-02T12:00:00Z" });
    expect(awaitsHolder(returned, [returned, newer])).toBe(false);
  });

  it("keeps a lapse open when the newer upload was itself returned", () => {
    const lapsed = card({ state: "lapsed" });
    const returnedRenewal = card({ state: "returned", submittedAt: "2026-11-05T12:00:00Z" });
    expect(awaitsHolder(lapsed, [lapsed, returnedRenewal])).toBe(true);
    const pending = card({ state: "submitted", submittedAt: "2026-11-06T12:00:00Z" });
    expect(awaitsHolder(lapsed, [lapsed, returnedRenewal, pending])).toBe(false);
  });

  it("does not let another technician's card or another type answer it", () => {
    const lapsed = card({ state: "lapsed" });
    const others = [
      card({ technicianId: 8, submittedAt: "2026-11-05T12:00:00Z" }),
      card({ typeCode: "lockout_tagout", submittedAt: "2026-11-05T12:00:00Z" }),
    ];
    expect(awaitsHolder(lapsed, [lapsed, ...others])).toBe(true);
  });

  it("keeps builder training per builder and control family", () => {
    const oem = (builder: string, submittedAt: string, state: FollowUpCandidate["state"]) =>
      card({ typeCode: "oem_training", state, submittedAt, fields: { builder, controlFamily: "Series 9" } });
    const lapsed = oem("Vantor Machine Works", "2026-10-01T12:00:00Z", "lapsed");
    expect(awaitsHolder(lapsed, [lapsed, oem("Brackwell Tool", "2026-11-05T12:00:00Z", "verified")])).toBe(
      true,
    );
    expect(
      awaitsHolder(lapsed, [lapsed, oem("Vantor Machine Works", "2026-11-05T12:00:00Z", "verified")]),
    ).toBe(false);
  });

  it("waits for nobody in any other state", () => {
    for (const state of ["submitted", "verified", "superseded"] as const)
      expect(awaitsHolder(card({ state }), [])).toBe(false);
  });
});
