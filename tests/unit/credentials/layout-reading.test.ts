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

describe("reading cells wrapped onto the next line", () => {
  // Common practice: narrow cards and two-column certificates wrap a long value (or label) inside its own cell.
  const at = (text: string, x: number, y: number) => ({
    page: 1,
    text,
    x,
    y,
    w: text.length * 0.006,
    h: 0.012,
  });

  it("joins a line that starts under the value, with the label column blank, to that value", () => {
    const items = [
      at("Participant", 0.05, 0.1),
      at("Corwin Vellacott", 0.4, 0.1),
      at("Training", 0.05, 0.12),
      at("Powered Industrial Truck", 0.4, 0.12),
      at("Operator Evaluation", 0.4, 0.132),
      at("Issued", 0.05, 0.152),
      at("04/14/2025", 0.4, 0.152),
    ];

    const text = layoutText(items);
    const fields = proposeFields("forklift", "training", text).fields;

    expect(text.split("\n")[1]).toBe("Training   Powered Industrial Truck Operator Evaluation");
    expect(fields.course).toBe("Powered Industrial Truck Operator Evaluation");
    expect(fields.issueDate).toBe("2025-04-14");
  });

  it("keeps a line under the value as its own row when it is a row's spacing below, or carries its own label", () => {
    const spaced = [at("Training", 0.05, 0.1), at("Rigging", 0.4, 0.1), at("Forklift", 0.4, 0.125)];
    const labelled = [
      at("Issued", 0.05, 0.1),
      at("04/14/2025", 0.4, 0.1),
      at("Expires: 04/14/2026", 0.4, 0.112),
    ];

    expect(layoutText(spaced).split("\n")).toEqual(["Training   Rigging", "Forklift"]);
    expect(layoutText(labelled).split("\n")).toEqual(["Issued   04/14/2025", "Expires: 04/14/2026"]);
  });

  it("joins a label and its value both wrapped when the label carries on in lower case", () => {
    const items = [
      at("Commercial General Liability", 0.05, 0.08),
      at("Insurer affording", 0.05, 0.1),
      at("Cobblestone Mutual Casualty", 0.3, 0.1),
      at("coverage", 0.05, 0.112),
      at("Co., NAIC 03463", 0.3, 0.112),
      at("Policy number", 0.05, 0.132),
      at("GL-124932", 0.3, 0.132),
    ];

    const text = layoutText(items);
    const fields = proposeFields("general_liability", "insurance", text).fields;

    expect(text.split("\n")[1]).toBe(
      "Insurer affording coverage   Cobblestone Mutual Casualty Co., NAIC 03463",
    );
    expect(fields.insurerName).toBe("Cobblestone Mutual Casualty Co.");
    expect(fields.naic).toBe("03463");
    expect(fields.policyNumber).toBe("GL-124932");
  });
});

describe("reading two columns that do not start on the same line", () => {
  // Common practice: side-by-side coverage blocks whose headings wrap differently, with a full-width heading under them.
  const at = (text: string, x: number, y: number) => ({
    page: 1,
    text,
    x,
    y,
    w: text.length * 0.006,
    h: 0.012,
  });
  const left: Array<[string, string]> = [
    ["Insurer", "Wrenfold Assurance Corp., NAIC 09856"],
    ["Pol #", "UX-470187"],
    ["Eff date", "02/26/2026"],
    ["Exp date", "02/26/2027"],
    ["Additional insured", "Y"],
  ];
  const right: Array<[string, string]> = [
    ["Insurer", "Saltmarsh Assurance Corp., NAIC 03133"],
    ["Pol #", "WC-146290"],
    ["Eff date", "03/24/2026"],
    ["Exp date", "03/24/2027"],
    ["Additional insured", "N"],
  ];
  const items = [
    at("UMBRELLA LIABILITY", 0.05, 0.1),
    at("WORKERS COMPENSATION AND EMPLOYERS'", 0.55, 0.1),
    at("LIABILITY", 0.55, 0.12),
    ...left.flatMap(([label, value], i) => [
      at(label, 0.05, 0.12 + i * 0.02),
      at(value, 0.22, 0.12 + i * 0.02),
    ]),
    ...right.flatMap(([label, value], i) => [
      at(label, 0.55, 0.14 + i * 0.02),
      at(value, 0.72, 0.14 + i * 0.02),
    ]),
    at("DESCRIPTION OF OPERATIONS", 0.05, 0.28),
    at("Repair and calibration of CNC machine tools at the holder's plant.", 0.05, 0.3),
  ];

  it("finds the gutter when the right block runs a line lower, and reads each block with its own values", () => {
    const text = layoutText(items);
    const umbrella = proposeFields("umbrella_liability", "insurance", text).fields;
    const workers = proposeFields("workers_comp", "insurance", text).fields;

    expect(umbrella.policyNumber).toBe("UX-470187");
    expect(umbrella.naic).toBe("09856");
    expect(umbrella.additionalInsured).toBe(true);
    expect(workers.policyNumber).toBe("WC-146290");
    expect(workers.naic).toBe("03133");
    expect(workers.effectiveDate).toBe("2026-03-24");
    expect(workers.additionalInsured).toBe(false);
  });

  it("reads a heading under both columns after the right block, so the right block's coverage is not cut off", () => {
    const level = [
      at("UMBRELLA LIABILITY", 0.05, 0.1),
      at("WORKERS COMPENSATION", 0.55, 0.1),
      ...left.flatMap(([label, value], i) => [
        at(label, 0.05, 0.12 + i * 0.02),
        at(value, 0.22, 0.12 + i * 0.02),
      ]),
      ...right.flatMap(([label, value], i) => [
        at(label, 0.55, 0.12 + i * 0.02),
        at(value, 0.72, 0.12 + i * 0.02),
      ]),
      at("DESCRIPTION OF OPERATIONS", 0.05, 0.26),
      at("Repair and calibration of CNC machine tools at the holder's plant.", 0.05, 0.28),
    ];

    const text = layoutText(level);
    const lines = text.split("\n");
    const workers = proposeFields("workers_comp", "insurance", text).fields;

    expect(lines.indexOf("DESCRIPTION OF OPERATIONS")).toBeGreaterThan(lines.indexOf("Pol #   WC-146290"));
    expect(workers.policyNumber).toBe("WC-146290");
  });
});

describe("reading a limit printed under its label", () => {
  // Common practice: auto liability's combined single limit is printed with its qualifier "(each accident)".
  it("takes the amount on the next line when the label's line carries only a qualifier and no figure", () => {
    const text = [
      "AUTOMOBILE LIABILITY",
      "Pol #",
      "CA 139 7332",
      "Combined Single Limit (ea accident)",
      "1MM",
      "Additional Insured",
      "N",
    ].join("\n");

    const fields = proposeFields("auto_liability", "insurance", text).fields;

    expect(fields.limits).toEqual({ combinedSingleLimit: 1_000_000 });
  });
});
