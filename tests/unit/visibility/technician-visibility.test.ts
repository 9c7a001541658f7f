import { describe, expect, it } from "vitest";
import {
  pickTechnicianFields,
  snapshotForBuyer,
  technicianViewLevel,
  type TechnicianFacts,
  type ViewerFacts,
} from "../../../shared/visibility/technician-visibility.ts";
import { buildStandingSnapshot } from "../../../shared/work-orders/standing-snapshot.ts";

const shop: ViewerFacts = { role: "buyer", sameCompany: false, isSelf: false, engaged: false };
const listed: TechnicianFacts = { active: true, baseline: "lapsing" };

describe("what a shop may see of a technician", () => {
  it("sees nothing of a technician who is inactive, not cleared or never computed", () => {
    const hidden: TechnicianFacts[] = [
      { active: false, baseline: "cleared" },
      { active: true, baseline: "not_cleared" },
      { active: true, baseline: null },
    ];

    const levels = hidden.map((t) => technicianViewLevel({ ...shop, engaged: true }, t));

    expect(levels).toEqual(["none", "none", "none"]);
  });

  it("sees the directory profile of a lapsing (still in force) technician, and contact only once engaged", () => {
    expect(technicianViewLevel(shop, listed)).toBe("directory");
    expect(technicianViewLevel({ ...shop, engaged: true }, listed)).toBe("contact");
  });

  it("keeps other service companies and colleagues out, while the own company, reviewers and admins see all", () => {
    const hidden: TechnicianFacts = { active: false, baseline: null };

    expect(technicianViewLevel({ ...shop, role: "provider_admin" }, listed)).toBe("none");
    expect(technicianViewLevel({ ...shop, role: "technician", sameCompany: true }, listed)).toBe("none");
    expect(technicianViewLevel({ ...shop, role: "provider_admin", sameCompany: true }, hidden)).toBe("full");
    expect(technicianViewLevel({ ...shop, role: "reviewer" }, hidden)).toBe("full");
  });

  it("drops contact fields from a record read at the directory level", () => {
    const record = {
      id: 7,
      name: "Ada Quell",
      email: "ada@example.test",
      phone: "555-0100",
      postalCode: "60601",
      active: true,
    };

    expect(pickTechnicianFields(record, "directory")).toEqual({ id: 7, name: "Ada Quell" });
    expect(pickTechnicianFields(record, "contact")).toEqual({
      id: 7,
      name: "Ada Quell",
      email: "ada@example.test",
      phone: "555-0100",
      postalCode: "60601",
    });
  });
});

describe("a standing snapshot as a shop reads it", () => {
  const snapshot = buildStandingSnapshot({
    takenAt: new Date("2026-11-02T15:00:00Z"),
    technician: { id: 3, name: "Ada Quell", companyName: "Harrowgate Spindle Service" },
    targets: [
      {
        requirementSetId: null,
        name: "Platform baseline",
        result: {
          standing: "cleared",
          earliestLapse: null,
          results: [
            {
              requirement: { label: "General liability", typeCodes: ["general_liability"] },
              status: "met",
              reason: null,
              detail: "In force",
              credentialId: 1,
              lapsesAt: null,
            },
            {
              requirement: { label: "OSHA 10", typeCodes: ["osha_10"] },
              status: "met",
              reason: null,
              detail: "In force",
              credentialId: 2,
              lapsesAt: null,
            },
          ],
        },
      },
    ],
    credentials: new Map([
      [
        1,
        {
          id: 1,
          typeCode: "general_liability",
          fields: {
            insurerName: "Lantern Mutual",
            policyNumber: "GL-4471",
            effectiveDate: "2026-01-01",
            expirationDate: "2027-01-01",
            limits: {},
            additionalInsured: false,
            waiverOfSubrogation: false,
          },
        },
      ],
      [
        2,
        {
          id: 2,
          typeCode: "osha_10",
          fields: { holderName: "Ada Quell", issueDate: "2025-03-14", cardNumber: "OC-99812" },
        },
      ],
    ]),
    typeNames: new Map(),
  } as never);

  it("keeps the policy number and leaves out the card number", () => {
    const refs = snapshotForBuyer(snapshot).targets[0]!.requirements.map((r) => r.credential?.reference);

    expect(snapshot.targets[0]!.requirements.map((r) => r.credential?.reference)).toEqual([
      "GL-4471",
      "OC-99812",
    ]);
    expect(refs).toEqual(["GL-4471", null]);
  });

  it("shows a shop no number from a snapshot stored before the field was recorded", () => {
    const old = structuredClone(snapshot);
    for (const r of old.targets[0]!.requirements) delete r.credential!.referenceField;

    const refs = snapshotForBuyer(old).targets[0]!.requirements.map((r) => r.credential?.reference);

    expect(refs).toEqual([null, null]);
  });
});
