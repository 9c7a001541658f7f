import { describe, expect, it } from "vitest";
import { proposeCoverages, proposeFields } from "../../../shared/credentials/extract-fields.ts";
import { layoutText } from "../../../shared/credentials/locate-values.ts";

describe("reading certificates laid out one field per line", () => {
  const text = [
    "EVIDENCE OF INSURANCE",
    "Insurer A: Fernhollow Mutual Casualty Co.        NAIC 39914",
    "Insurer C: Workers Comp Assurance of Ohlen       NAIC 27703",
    "Named insured",
    "Pellworth Spindle Repair LLC",
    "82 Gantry Row, Ashford Hollow, OH 44077",
    "COVERAGES",
    "General Liability",
    "Insurer: A",
    "Policy No.: CGL 778 1203",
    "Effective: 15 Mar 2026",
    "Expires: March 15, 2027",
    "Each occurrence $1M",
    "General aggregate $2MM",
    "Additional insured: Y",
    "Waiver of subrogation: N",
    "Workers Compensation",
    "Insurer: C",
    "Pol # WC 4410 77",
    "Effective date 2026-03-15",
    "Expiration date 2027-03-15",
    "E.L. each accident 1,000,000.00",
    "Additional insured: N",
    "Waiver of subrogation: Y",
    "DESCRIPTION OF OPERATIONS",
  ].join("\n");

  it("does not take an insurer's letter line for a coverage heading", () => {
    const proposal = proposeCoverages(text);

    expect(proposal.coverages.map((c) => c.typeCode)).toEqual(["general_liability", "workers_comp"]);
  });

  it("reads each coverage's labelled lines: spaced policy numbers, spelled dates, $1M, and marks on their own lines", () => {
    const gl = proposeFields("general_liability", "insurance", text).fields;
    const wc = proposeFields("workers_comp", "insurance", text).fields;

    expect(gl).toMatchObject({
      insurerName: "Fernhollow Mutual Casualty Co.",
      policyNumber: "CGL 778 1203",
      effectiveDate: "2026-03-15",
      expirationDate: "2027-03-15",
      additionalInsured: true,
      waiverOfSubrogation: false,
      limits: { eachOccurrence: 1_000_000, generalAggregate: 2_000_000 },
    });
    expect(wc).toMatchObject({
      insurerName: "Workers Comp Assurance of Ohlen",
      policyNumber: "WC 4410 77",
      effectiveDate: "2026-03-15",
      expirationDate: "2027-03-15",
      additionalInsured: false,
      waiverOfSubrogation: true,
      limits: { employersLiabilityEachAccident: 1_000_000 },
    });
  });

  it("takes the name under its label, not the address line after it", () => {
    const { parties } = proposeCoverages(text);

    expect(parties.namedInsured).toBe("Pellworth Spindle Repair LLC");
  });
});

describe("reading training cards in other wordings", () => {
  it("reads values printed on the line below their labels", () => {
    const text = [
      "FORKLIFT OPERATOR EVALUATION",
      "Name of operator",
      "Maren Oduya-Feld",
      "Date of evaluation",
      "04/02/2026",
      "Re-evaluation due",
      "04/02/2029",
      "Evaluator",
      "Tomasz Reinholt",
    ].join("\n");

    const fields = proposeFields("powered_truck", "training", text).fields;

    expect(fields).toMatchObject({
      holderName: "Maren Oduya-Feld",
      issueDate: "2026-04-02",
      expiryDate: "2029-04-02",
      trainer: "Tomasz Reinholt",
    });
  });

  it("reads a month-only renewal as valid through the end of that month (common practice)", () => {
    const text = [
      "Student: Ilse Marrow",
      "Course: Heartsaver First Aid CPR AED",
      "Issued on: 03/04/2025",
      "Recommended renewal: 03/2027",
    ].join("\n");

    const fields = proposeFields("first_aid_cpr", "training", text).fields;

    expect(fields).toMatchObject({ issueDate: "2025-03-04", expiryDate: "2027-03-31" });
  });

  it("reads a sentence card: this certifies that NAME has completed COURSE", () => {
    const text = [
      "CERTIFICATE OF COMPLETION",
      "This certifies that Odalys Brenneman has successfully completed",
      "Control of Hazardous Energy (Lockout/Tagout).",
      "Completed on 15 Jan 2026      Valid through January 15, 2027",
    ].join("\n");

    const fields = proposeFields("lockout_tagout", "training", text).fields;

    expect(fields).toMatchObject({
      holderName: "Odalys Brenneman",
      course: "Control of Hazardous Energy (Lockout/Tagout)",
      issueDate: "2026-01-15",
      expiryDate: "2027-01-15",
    });
  });

  it("joins a course title wrapped over two lines", () => {
    const text = [
      "Participant: Ravi Thorsby",
      "Course title: Electrical Safety and Arc Flash Awareness for",
      "machine service technicians",
      "Completion date: 2026-05-01",
    ].join("\n");

    const fields = proposeFields("arc_flash", "training", text).fields;

    expect(fields.course).toBe("Electrical Safety and Arc Flash Awareness for machine service technicians");
  });
});

describe("reading two coverages printed side by side", () => {
  // Common practice: certificates that are not the standard form often set coverage blocks in two columns.
  const at = (text: string, x: number, y: number) => ({
    page: 1,
    text,
    x,
    y,
    w: text.length * 0.006,
    h: 0.012,
  });
  const rows: Array<[string, string, string, string]> = [
    ["Insurer", "Fernhollow Mutual", "Insurer", "Ashcombe Casualty"],
    ["Policy number", "GL-204411", "Policy number", "CA-771203"],
    ["Effective date", "03/15/2026", "Effective date", "04/01/2026"],
  ];
  const items = [
    at("Commercial General Liability", 0.05, 0.1),
    at("Business Auto Liability", 0.55, 0.1),
    ...rows.flatMap(([l1, v1, l2, v2], i) => [
      at(l1, 0.05, 0.13 + i * 0.02),
      at(v1, 0.25, 0.13 + i * 0.02),
      at(l2, 0.55, 0.13 + i * 0.02),
      at(v2, 0.75, 0.13 + i * 0.02),
    ]),
  ];

  it("reads the left block to its end before the right one, so no value is joined to the other's labels", () => {
    const text = layoutText(items);

    expect(text.split("\n").slice(0, 4)).toEqual([
      "Commercial General Liability",
      "Insurer   Fernhollow Mutual",
      "Policy number   GL-204411",
      "Effective date   03/15/2026",
    ]);
    const auto = proposeFields("auto_liability", "insurance", text).fields;
    expect(auto.policyNumber).toBe("CA-771203");
    expect(auto.effectiveDate).toBe("2026-04-01");
  });

  it("keeps a label and value table that never repeats its label across a row as one column", () => {
    const table = [at("Policy number", 0.05, 0.1), at("GL-204411", 0.55, 0.1)];

    expect(layoutText(table)).toBe("Policy number   GL-204411");
  });
});
