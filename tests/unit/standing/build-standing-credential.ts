import type {
  InsuranceFields,
  OemFields,
  TrainingFields,
} from "../../../shared/credentials/credential-fields.ts";
import type { StandingCredential } from "../../../shared/standing/standing-types.ts";

let nextId = 1;

/** A verified general liability certificate with typical limits (common practice); override what the test is about. */
export function buildInsuranceCredential(
  overrides: Partial<Omit<StandingCredential, "fields">> = {},
  fields: Partial<InsuranceFields> = {},
): StandingCredential {
  return {
    id: nextId++,
    typeCode: "general_liability",
    state: "verified",
    holder: "company",
    ...overrides,
    fields: {
      insurerName: "Larkspur Mutual",
      naic: "12345",
      policyNumber: "GL-4471",
      effectiveDate: "2026-07-15",
      expirationDate: "2027-07-15",
      limits: { eachOccurrence: 1_000_000, generalAggregate: 2_000_000 },
      additionalInsured: true,
      waiverOfSubrogation: true,
      ...fields,
    },
  };
}

export function buildTrainingCredential(
  overrides: Partial<Omit<StandingCredential, "fields">> = {},
  fields: Partial<TrainingFields> = {},
): StandingCredential {
  return {
    id: nextId++,
    typeCode: "arc_flash",
    state: "verified",
    holder: "technician",
    ...overrides,
    fields: { holderName: "Dana Quillfeather", issueDate: "2025-05-15", ...fields },
  };
}

export function buildOemCredential(
  overrides: Partial<Omit<StandingCredential, "fields">> = {},
  fields: Partial<OemFields> = {},
): StandingCredential {
  return {
    id: nextId++,
    typeCode: "oem_training",
    state: "verified",
    holder: "technician",
    ...overrides,
    fields: {
      holderName: "Dana Quillfeather",
      issueDate: "2025-09-01",
      builder: "Orrin Machine Works",
      controlFamily: "Tessaline 9",
      level: 2,
      ...fields,
    },
  };
}
