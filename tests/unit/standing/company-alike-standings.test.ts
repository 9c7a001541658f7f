import { describe, expect, it } from "vitest";
import { computeTechnicianStanding } from "../../../shared/standing/compute-standing.ts";
import { credentialTypeByCode } from "../../../shared/credentials/catalogue.ts";
import type { Requirement } from "../../../shared/standing/requirements.ts";
import type { StandingCredential } from "../../../shared/standing/standing-types.ts";
import { computeStandings } from "../../../server/standing/compute-stored-standings.ts";
import type { StandingInputs, StandingTechnician } from "../../../server/standing/standing-inputs.ts";
import { lapsingWindowDays } from "../../../server/standing/standing-window.ts";
import { buildInsuranceCredential, buildTrainingCredential } from "./build-standing-credential.ts";

// Common practice, varies by state: a workers' compensation exemption covers only the persons it names.
const asOf = new Date("2027-01-10T15:00:00Z");
const baseline: Requirement[] = [
  { label: "General liability", typeCodes: ["general_liability"] },
  { label: "Workers' compensation", typeCodes: ["workers_comp", "workers_comp_exemption"] },
];
const arcFlash: Requirement[] = [{ label: "Arc flash", typeCodes: ["arc_flash"] }];
const exemption: StandingCredential = {
  id: 900,
  typeCode: "workers_comp_exemption",
  state: "verified",
  holder: "company",
  fields: {
    holderName: "Rowan Ashgrove",
    state: "TX",
    certificateNumber: "EX-77",
    issueDate: "2026-03-01",
    personsCovered: ["Rowan Ashgrove"],
    technicianIds: [],
  } as StandingCredential["fields"],
};
const technician = (id: number, companyId: number, name: string): StandingTechnician => ({
  id,
  companyId,
  active: true,
  timeZone: companyId === 1 ? "America/Chicago" : "America/Denver",
  name,
  companyHeadcount: 1,
});

/** The engine run for each technician on its own, as before the company's standing was shared. */
function oneByOne(inputs: StandingInputs) {
  return inputs.technicians.flatMap((t) =>
    inputs.targets.map((target) => ({
      ...computeTechnicianStanding({
        companyCredentials: inputs.companyCredentials.get(t.companyId) ?? [],
        technicianCredentials: inputs.technicianCredentials.get(t.id) ?? [],
        requirements: target.requirements,
        companyTimeZone: t.timeZone,
        technician: { id: t.id, name: t.name },
        companyHeadcount: t.companyHeadcount,
        asOf,
        warningDays: lapsingWindowDays(),
        types: inputs.types,
      }),
      technicianId: t.id,
      companyId: t.companyId,
      requirementSetId: target.id,
    })),
  );
}

describe("standings of a company's technicians", () => {
  it("are the engine's own for each technician, with or without cards, an exemption or a second company", () => {
    const inputs: StandingInputs = {
      technicians: [
        technician(1, 1, "Rowan Ashgrove"),
        technician(2, 1, "Imke Vossberg"),
        technician(3, 1, "Tal Brennock"),
        technician(4, 2, "Rowan Ashgrove"),
        technician(5, 2, "Imke Vossberg"),
        technician(6, 2, "Oda Pell"),
      ],
      companyCredentials: new Map([
        [1, [buildInsuranceCredential(), buildInsuranceCredential({ typeCode: "workers_comp" })]],
        [2, [buildInsuranceCredential({}, { expirationDate: "2027-01-20" }), exemption]],
      ]),
      technicianCredentials: new Map([[3, [buildTrainingCredential({ typeCode: "arc_flash" })]]]),
      types: credentialTypeByCode as StandingInputs["types"],
      targets: [
        { id: null, name: "Platform baseline", requirements: baseline },
        { id: 7, name: "Arc flash", requirements: arcFlash },
      ],
    };

    const computed = computeStandings(inputs, asOf);

    expect(computed).toEqual(oneByOne(inputs));
    // The exemption names Rowan only, so the second company's technicians do not stand alike.
    const second = computed.filter((c) => c.companyId === 2 && c.requirementSetId === null);
    expect(new Set(second.map((c) => c.results[1]?.status)).size).toBe(2);
    // A card of one's own sets a technician apart from the company's others.
    const arc = computed.filter((c) => c.companyId === 1 && c.requirementSetId === 7);
    expect(arc.map((c) => c.standing)).toEqual(["not_cleared", "not_cleared", "cleared"]);
  });
});
