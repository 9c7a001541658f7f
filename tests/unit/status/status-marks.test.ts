import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import {
  credentialStatuses,
  machineTransferOnlyStatuses,
  markSvg,
  requirementStatuses,
  standingStatuses,
  statusMarks,
  workOrderStatuses,
  type StatusMeaning,
} from "../../../shared/status/status-marks.ts";
import { renderStandingProof } from "../../../server/work-orders/standing-proof-page.ts";

const root = path.resolve(import.meta.dirname, "../../..");
const meanings = Object.keys(statusMarks) as StatusMeaning[];
const geometry = (m: StatusMeaning) => JSON.stringify(statusMarks[m].elements);

describe("status marks", () => {
  it("gives every meaning its own shape, its own shape name and its own word", () => {
    expect(new Set(meanings.map(geometry)).size).toBe(meanings.length);
    expect(new Set(meanings.map((m) => statusMarks[m].shape)).size).toBe(meanings.length);
    expect(new Set(meanings.map((m) => statusMarks[m].word)).size).toBe(meanings.length);
  });

  it("covers every status of standings, requirements, documents and work orders", () => {
    const all = new Set<string>([
      ...standingStatuses,
      ...requirementStatuses,
      ...credentialStatuses,
      ...workOrderStatuses,
      ...machineTransferOnlyStatuses,
    ]);

    expect(new Set(meanings)).toEqual(all);
  });

  it("draws the printed proof with the same shapes as the screens", () => {
    const page = renderStandingProof(
      {
        workOrderId: 7,
        shopName: "Shop",
        siteName: "Plant 2",
        technology: "mill",
        timeZone: "America/Chicago",
      },
      [
        {
          title: "When the technician accepted",
          snapshot: {
            takenAt: "2027-03-01T18:30:00.000Z",
            technicianId: 1,
            technicianName: "Ada Quill",
            companyName: "Quill Service",
            standing: "lapsing",
            targets: [
              {
                requirementSetId: null,
                name: "Platform baseline",
                standing: "lapsing",
                earliestLapse: "2027-03-20T06:00:00.000Z",
                requirements: [
                  {
                    label: "General liability",
                    status: "lapsing",
                    reason: null,
                    detail: "",
                    credential: {
                      id: 1234,
                      typeCode: "general_liability",
                      typeName: "Commercial general liability",
                      reference: "GL-1",
                      lapsesAt: "2027-03-20T06:01:00.000Z",
                    },
                  },
                ],
              },
            ],
          },
        },
      ],
    );

    expect(page).toContain(markSvg("lapsing"));
    expect(page).not.toContain("▲");
    // Names and local times, never internal ids or UTC.
    expect(page).not.toContain("1234");
    expect(page).not.toContain("UTC");
    expect(page).toContain("Mar 1, 2027, 12:30 PM CST");
    // 12:01 a.m. standard time is 1:01 a.m. on the clock while daylight time is in force (policy-period wording).
    expect(page).toContain("Mar 20, 2027, 1:01 AM CDT");
    expect(page).toContain("Mill");
    expect(page).toContain("verified and in force today");
    expect(page).toContain("29 CFR 1910.147");
  });

  it("leaves no shape drawn outside the shared table in the client's badges", () => {
    for (const file of [
      "src/components/ui/status-badge.tsx",
      "src/features/work-orders/components/work-order-status-badge.tsx",
    ]) {
      expect(readFileSync(path.join(root, file), "utf8")).not.toMatch(/<(circle|path|rect)\b/);
    }
  });
});
