import type { Limits } from "../../../shared/credentials/credential-fields.ts";
import type { CredentialState } from "../../../shared/credentials/schemas.ts";
import { addCalendarMonths } from "../../../shared/standing/training-validity.ts";
import type { CertificateCoverage, CoverageCode } from "./documents/build-certificate-pdf.ts";
import { demoCompanies, type DemoCompany } from "./companies.ts";
import type { DemoCalendar } from "./demo-calendar.ts";
import type { DemoCredential } from "./demo-world-types.ts";
import { demoNaic } from "./demo-naic.ts";

// Invented insurers, with NAIC codes of a shape no insurer should hold (demo-naic.ts).
const INSURERS = {
  granite: { name: "Granite Ledger Mutual Insurance Co.", naic: demoNaic(24) },
  northwind: { name: "Northwind Harbor Casualty Company", naic: demoNaic(31) },
  ironvale: { name: "Ironvale Indemnity Corp.", naic: demoNaic(40) },
  quillmoor: { name: "Quillmoor Assurance Company", naic: demoNaic(17) },
} as const;
type InsurerKey = keyof typeof INSURERS;

const OFFICES: Record<
  string,
  { cityLine: string; agency: string; agencyLines: string[]; holderKey: string }
> = {
  kestrel: {
    cityLine: "Chicago, IL 60601",
    agency: "Pinecrest Risk Partners",
    agencyLines: ["410 Wickerbay Street", "Chicago, IL 60606"],
    holderKey: "marlow",
  },
  bluewater: {
    cityLine: "Milwaukee, WI 53202",
    agency: "Harbor Ridge Insurance Agency",
    agencyLines: ["12 Breakwater Plaza", "Milwaukee, WI 53203"],
    holderKey: "tamsin",
  },
  copperline: {
    cityLine: "Indianapolis, IN 46204",
    agency: "Calder Bay Insurance Group",
    agencyLines: ["3300 Larkspur Row", "Indianapolis, IN 46204"],
    holderKey: "marlow",
  },
};

// Typical limits a machine shop asks of a field-service contractor (common practice).
const GL_LIMITS: Limits = {
  eachOccurrence: 1_000_000,
  damageToRentedPremises: 100_000,
  medicalExpense: 10_000,
  personalAdvertisingInjury: 1_000_000,
  generalAggregate: 2_000_000,
  productsCompletedOpsAggregate: 2_000_000,
};
const AUTO_LIMITS: Limits = { combinedSingleLimit: 1_000_000 };
const WC_LIMITS: Limits = {
  employersLiabilityEachAccident: 1_000_000,
  employersLiabilityDiseaseEachEmployee: 1_000_000,
  employersLiabilityDiseasePolicyLimit: 1_000_000,
};
const UMBRELLA_LIMITS: Limits = { umbrellaEachOccurrence: 2_000_000, umbrellaAggregate: 2_000_000 };

interface PolicySpec {
  key: string;
  companyKey: string;
  code: CoverageCode;
  insurer: InsurerKey;
  policyNumber: string;
  effectiveDate: string;
  limits: Limits;
  additionalInsured?: boolean;
  waiverOfSubrogation?: boolean;
  state: CredentialState;
  /** Calendar date the office uploaded it; the reviewer decides the next day unless still submitted. */
  submittedOn: string;
}

// Annual policy terms (common practice).
const oneYearOn = (isoDate: string) => addCalendarMonths(isoDate, 12);

function company(key: string): DemoCompany {
  const found = demoCompanies.find((candidate) => candidate.key === key);
  if (!found) throw new Error(`No demo company ${key}`);
  return found;
}

function officeEmail(companyKey: string): string {
  const admin = company(companyKey).users.find((user) => user.role === "provider_admin");
  if (!admin) throw new Error(`No provider_admin for ${companyKey}`);
  return admin.email;
}

function insuranceCredential(spec: PolicySpec, calendar: DemoCalendar): DemoCredential {
  const insured = company(spec.companyKey);
  const office = OFFICES[spec.companyKey];
  if (!office) throw new Error(`No office for ${spec.companyKey}`);
  const insurer = INSURERS[spec.insurer];
  const holder = company(office.holderKey);
  const coverage: CertificateCoverage = {
    insurerLetter: "A",
    policyNumber: spec.policyNumber,
    effectiveDate: spec.effectiveDate,
    expirationDate: oneYearOn(spec.effectiveDate),
    additionalInsured: spec.additionalInsured ?? false,
    waiverOfSubrogation: spec.waiverOfSubrogation ?? false,
    limits: spec.limits,
    ...(spec.code === "workers_comp" ? { statutory: true } : {}),
  };
  const fields = {
    insurerName: insurer.name,
    naic: insurer.naic,
    policyNumber: coverage.policyNumber,
    namedInsured: insured.name,
    certificateHolder: holder.name,
    effectiveDate: coverage.effectiveDate,
    expirationDate: coverage.expirationDate,
    limits: coverage.limits,
    additionalInsured: coverage.additionalInsured,
    waiverOfSubrogation: coverage.waiverOfSubrogation,
    ...(coverage.statutory ? { statutory: true } : {}),
  };
  const decided = spec.state !== "submitted";
  return {
    key: spec.key,
    typeCode: spec.code,
    companyKey: spec.companyKey,
    technicianKey: null,
    state: spec.state,
    fields,
    returnReason: null,
    submittedBy: officeEmail(spec.companyKey),
    submittedAt: calendar.at(spec.submittedOn, 9),
    decidedAt: decided ? calendar.at(spec.submittedOn, 15) : null,
    document: {
      kind: "certificate",
      coverage: spec.code,
      fileName: `${spec.companyKey}-${spec.code.replace(/_/g, "-")}-${coverage.effectiveDate}.pdf`,
      values: {
        issueDate: spec.submittedOn,
        producer: { name: office.agency, lines: office.agencyLines },
        insured: { name: insured.name, lines: [insured.addressLine, office.cityLine] },
        insurers: [{ letter: "A", ...insurer }],
        coverages: { [spec.code]: coverage },
        holder: { name: holder.name, lines: [holder.addressLine] },
        description: ["Field service, repair and calibration of CNC machine tools at the holder's premises."],
        dateFormat: "MM/DD/YYYY",
        flagStyle: "y_n",
        pages: 1,
      },
    },
  };
}

/**
 * The service companies' insurance: Kestrel fully in force (the one umbrella, and additional insured plus waiver
 * on its liability lines); Bluewater's general liability ends 17 days from today, so it shows as lapsing;
 * Copperline's general liability lapsed 9 days ago and its renewal waits in the reviewer's queue.
 */
export function demoInsurance(calendar: DemoCalendar): DemoCredential[] {
  const kestrelStart = calendar.months(-4);
  const bluewaterGlStart = calendar.months(-12, 17);
  const copperlineLapsedStart = calendar.months(-12, -9);
  const copperlineRenewalStart = oneYearOn(copperlineLapsedStart);
  const specs: PolicySpec[] = [
    {
      key: "kestrel-gl",
      companyKey: "kestrel",
      code: "general_liability",
      insurer: "granite",
      policyNumber: "CGL-4417702",
      effectiveDate: kestrelStart,
      limits: GL_LIMITS,
      additionalInsured: true,
      waiverOfSubrogation: true,
      state: "verified",
      submittedOn: calendar.months(-4, -6),
    },
    {
      key: "kestrel-auto",
      companyKey: "kestrel",
      code: "auto_liability",
      insurer: "granite",
      policyNumber: "BAU-4417703",
      effectiveDate: kestrelStart,
      limits: AUTO_LIMITS,
      additionalInsured: true,
      waiverOfSubrogation: true,
      state: "verified",
      submittedOn: calendar.months(-4, -6),
    },
    {
      key: "kestrel-wc",
      companyKey: "kestrel",
      code: "workers_comp",
      insurer: "northwind",
      policyNumber: "WCE-2209815",
      effectiveDate: kestrelStart,
      limits: WC_LIMITS,
      waiverOfSubrogation: true,
      state: "verified",
      submittedOn: calendar.months(-4, -5),
    },
    {
      key: "kestrel-umbrella",
      companyKey: "kestrel",
      code: "umbrella_liability",
      insurer: "ironvale",
      policyNumber: "UMB-7730416",
      effectiveDate: kestrelStart,
      limits: UMBRELLA_LIMITS,
      additionalInsured: true,
      state: "verified",
      submittedOn: calendar.months(-4, -5),
    },
    {
      key: "bluewater-gl",
      companyKey: "bluewater",
      code: "general_liability",
      insurer: "quillmoor",
      policyNumber: "GLP-5102264",
      effectiveDate: bluewaterGlStart,
      limits: GL_LIMITS,
      state: "verified",
      submittedOn: calendar.months(-12, 10),
    },
    {
      key: "bluewater-auto",
      companyKey: "bluewater",
      code: "auto_liability",
      insurer: "quillmoor",
      policyNumber: "CAP-5102265",
      effectiveDate: calendar.months(-2),
      limits: AUTO_LIMITS,
      state: "verified",
      submittedOn: calendar.months(-2, -4),
    },
    {
      key: "bluewater-wc",
      companyKey: "bluewater",
      code: "workers_comp",
      insurer: "northwind",
      policyNumber: "WKC-3384120",
      effectiveDate: calendar.months(-6),
      limits: WC_LIMITS,
      state: "verified",
      submittedOn: calendar.months(-6, -3),
    },
    {
      key: "copperline-gl-lapsed",
      companyKey: "copperline",
      code: "general_liability",
      insurer: "ironvale",
      policyNumber: "CGL-6650381",
      effectiveDate: copperlineLapsedStart,
      limits: GL_LIMITS,
      state: "lapsed",
      submittedOn: calendar.months(-12, -15),
    },
    {
      key: "copperline-gl-renewal",
      companyKey: "copperline",
      code: "general_liability",
      insurer: "ironvale",
      policyNumber: "CGL-6650381-01",
      effectiveDate: copperlineRenewalStart,
      limits: GL_LIMITS,
      state: "submitted",
      submittedOn: calendar.days(-2),
    },
    {
      key: "copperline-auto",
      companyKey: "copperline",
      code: "auto_liability",
      insurer: "granite",
      policyNumber: "BAU-8821947",
      effectiveDate: calendar.months(-7),
      limits: AUTO_LIMITS,
      state: "verified",
      submittedOn: calendar.months(-7, -3),
    },
    {
      key: "copperline-wc",
      companyKey: "copperline",
      code: "workers_comp",
      insurer: "northwind",
      policyNumber: "WCE-2290471",
      effectiveDate: calendar.months(-3),
      limits: WC_LIMITS,
      state: "verified",
      submittedOn: calendar.months(-3, -2),
    },
  ];
  return specs.map((spec) => insuranceCredential(spec, calendar));
}
