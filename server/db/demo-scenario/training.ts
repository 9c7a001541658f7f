import {
  FIRST_AID_CPR_MONTHS,
  LOCKOUT_REFRESHER_MONTHS,
  POWERED_TRUCK_EVALUATION_MONTHS,
} from "../../../shared/credentials/catalogue.ts";
import type { CredentialState } from "../../../shared/credentials/schemas.ts";
import { addCalendarDays } from "../../../shared/standing/iso-date.ts";
import { addCalendarMonths } from "../../../shared/standing/training-validity.ts";
import type { DocumentDateFormat } from "../../../shared/credentials/date-formats.ts";
import type { TrainingCardValues } from "./documents/build-training-card.ts";
import { demoCompanies } from "./companies.ts";
import type { DemoCalendar } from "./demo-calendar.ts";
import type { DemoCredential } from "./demo-world-types.ts";
import { demoBuilders } from "./machine-builders.ts";
import { demoTechnicians } from "./technicians.ts";

type SafetyCode = "osha_10" | "osha_30" | "arc_flash" | "lockout_tagout" | "powered_truck" | "first_aid_cpr";

// What an invented training provider prints on each card; `printedMonths` is printed as an expiry where cards usually carry one.
const COURSES: Record<
  SafetyCode,
  { course: string; provider: string; prefix: string; printedMonths?: number }
> = {
  osha_10: {
    course: "10-Hour General Industry Outreach",
    provider: "Ridgeway Industrial Academy",
    prefix: "GI10",
  },
  osha_30: {
    course: "30-Hour General Industry Outreach",
    provider: "Ridgeway Industrial Academy",
    prefix: "GI30",
  },
  // Arc-flash cards often print no expiry; the type's 36-month rule applies (catalogue.ts).
  arc_flash: {
    course: "Arc Flash Awareness (NFPA 70E)",
    provider: "Northfield Safety Institute",
    prefix: "AF",
  },
  lockout_tagout: {
    course: "Lockout/Tagout Authorized Employee",
    provider: "Northfield Safety Institute",
    prefix: "LT",
    printedMonths: LOCKOUT_REFRESHER_MONTHS,
  },
  powered_truck: {
    course: "Powered Industrial Truck Operator",
    provider: "Bramblecote Training Center",
    prefix: "PT",
    printedMonths: POWERED_TRUCK_EVALUATION_MONTHS,
  },
  first_aid_cpr: {
    course: "First Aid, CPR and AED",
    provider: "Bramblecote Training Center",
    prefix: "FA",
    printedMonths: FIRST_AID_CPR_MONTHS,
  },
};

const TRAINERS = ["Gwendolyn Asheby", "Piet Vanderhoeven", "Marguerite Lanyon", "Obadiah Fenn"];

interface CardSpec {
  key: string;
  technicianKey: string;
  typeCode: SafetyCode | "oem_training";
  issueDate: string;
  state: CredentialState;
  /** Defaults to two days after the issue date. */
  submittedOn?: string;
  expiryDate?: string;
  returnReason?: string;
  /** The name as printed, when it differs from the technician's. */
  printedName?: string;
  oem?: { builder: string; controlFamily: string; level: 1 | 2 | 3; course: string };
  supersededBy?: string;
}

function technician(key: string) {
  const found = demoTechnicians.find((candidate) => candidate.key === key);
  if (!found) throw new Error(`No demo technician ${key}`);
  return found;
}

/** A technician with an account uploads their own cards; the others' cards come in through the office. */
function uploaderEmail(technicianKey: string): string {
  const tech = technician(technicianKey);
  const company = demoCompanies.find((candidate) => candidate.key === tech.companyKey);
  const own = company?.users.find((user) => user.technicianKey === technicianKey);
  const office = company?.users.find((user) => user.role === "provider_admin");
  const email = own?.email ?? office?.email;
  if (!email) throw new Error(`No uploader for ${technicianKey}`);
  return email;
}

function cardCredential(spec: CardSpec, index: number, calendar: DemoCalendar): DemoCredential {
  const tech = technician(spec.technicianKey);
  const safety = spec.typeCode === "oem_training" ? undefined : COURSES[spec.typeCode];
  const expiryDate =
    spec.expiryDate ??
    (safety?.printedMonths ? addCalendarMonths(spec.issueDate, safety.printedMonths) : undefined);
  const cardNumber = `${safety?.prefix ?? "OEM"}-${String(40_000 + index * 377).padStart(5, "0")}-${(index % 9) + 1}`;
  const dateFormat: DocumentDateFormat = index % 2 === 0 ? "MM/DD/YYYY" : "YYYY-MM-DD";
  const values: TrainingCardValues = {
    provider: safety?.provider ?? `${spec.oem?.builder ?? ""} Service Academy`,
    holderName: spec.printedName ?? tech.name,
    course: safety?.course ?? spec.oem?.course ?? "",
    issueDate: spec.issueDate,
    ...(expiryDate ? { expiryDate } : {}),
    cardNumber,
    trainer: TRAINERS[index % TRAINERS.length] ?? "",
    dateFormat,
    ...(spec.oem
      ? { oem: { builder: spec.oem.builder, controlFamily: spec.oem.controlFamily, level: spec.oem.level } }
      : {}),
  };
  const fields = {
    holderName: values.holderName,
    course: values.course,
    issueDate: values.issueDate,
    ...(expiryDate ? { expiryDate } : {}),
    cardNumber: values.cardNumber,
    trainer: values.trainer,
    ...(values.oem ?? {}),
  };
  const submittedOn = spec.submittedOn ?? addCalendarDays(spec.issueDate, 2);
  return {
    key: spec.key,
    typeCode: spec.typeCode,
    companyKey: tech.companyKey,
    technicianKey: tech.key,
    state: spec.state,
    fields,
    returnReason: spec.returnReason ?? null,
    submittedBy: uploaderEmail(tech.key),
    submittedAt: calendar.at(submittedOn, 8),
    decidedAt: spec.state === "submitted" ? null : calendar.at(addCalendarDays(submittedOn, 1), 11),
    ...(spec.supersededBy ? { supersededBy: spec.supersededBy } : {}),
    document: {
      kind: "card",
      values,
      fileName: `${tech.key}-${spec.typeCode.replace(/_/g, "-")}-${spec.issueDate}.pdf`,
    },
  };
}

const { vantor, halden, orrin, strell } = demoBuilders;

/**
 * Technicians' cards in every state: most verified; four awaiting verification (the reviewer's queue);
 * one returned (the name on the card is not the technician's); one superseded by a newer card of the same type;
 * one lapsed (a first-aid card past its 24 months); and one lockout/tagout card ending 18 days from today.
 */
export function demoTraining(calendar: DemoCalendar): DemoCredential[] {
  const { days, months } = calendar;
  const specs: CardSpec[] = [
    {
      key: "tobias-osha30",
      technicianKey: "tobias",
      typeCode: "osha_30",
      issueDate: months(-30),
      state: "verified",
    },
    {
      key: "tobias-arc",
      technicianKey: "tobias",
      typeCode: "arc_flash",
      issueDate: months(-14),
      state: "verified",
    },
    {
      key: "tobias-loto-old",
      technicianKey: "tobias",
      typeCode: "lockout_tagout",
      issueDate: months(-12, -20),
      state: "superseded",
      supersededBy: "tobias-loto",
    },
    {
      key: "tobias-loto",
      technicianKey: "tobias",
      typeCode: "lockout_tagout",
      issueDate: days(-27),
      submittedOn: days(-25),
      state: "verified",
    },
    {
      key: "tobias-oem",
      technicianKey: "tobias",
      typeCode: "oem_training",
      issueDate: months(-8),
      expiryDate: months(16),
      state: "verified",
      oem: {
        builder: vantor.name,
        controlFamily: vantor.controls.mill,
        level: 2,
        course: "Spindle and Axis Service",
      },
    },
    {
      key: "tobias-firstaid",
      technicianKey: "tobias",
      typeCode: "first_aid_cpr",
      issueDate: months(-10),
      state: "verified",
    },
    {
      key: "noor-osha10",
      technicianKey: "noor",
      typeCode: "osha_10",
      issueDate: months(-40),
      state: "verified",
    },
    {
      key: "noor-loto",
      technicianKey: "noor",
      typeCode: "lockout_tagout",
      issueDate: months(-5),
      state: "verified",
    },
    {
      key: "noor-arc",
      technicianKey: "noor",
      typeCode: "arc_flash",
      issueDate: months(-20),
      state: "verified",
    },
    {
      key: "noor-firstaid",
      technicianKey: "noor",
      typeCode: "first_aid_cpr",
      issueDate: days(-3),
      submittedOn: days(-1),
      state: "submitted",
    },
    {
      key: "noor-oem",
      technicianKey: "noor",
      typeCode: "oem_training",
      issueDate: months(-15),
      state: "verified",
      oem: {
        builder: vantor.name,
        controlFamily: vantor.controls.lathe,
        level: 1,
        course: "Turning Center Operation and Setup",
      },
    },
    {
      key: "emeric-loto",
      technicianKey: "emeric",
      typeCode: "lockout_tagout",
      issueDate: months(-12, 18),
      state: "verified",
    },
    {
      key: "emeric-arc",
      technicianKey: "emeric",
      typeCode: "arc_flash",
      issueDate: months(-6),
      state: "verified",
    },
    {
      key: "emeric-oem",
      technicianKey: "emeric",
      typeCode: "oem_training",
      issueDate: months(-16),
      expiryDate: months(8),
      state: "verified",
      oem: {
        builder: strell.name,
        controlFamily: strell.controls.edm,
        level: 3,
        course: "Generator and Wire Path Service",
      },
    },
    {
      key: "emeric-truck",
      technicianKey: "emeric",
      typeCode: "powered_truck",
      issueDate: months(-16),
      state: "verified",
    },
    {
      key: "ysolde-osha10",
      technicianKey: "ysolde",
      typeCode: "osha_10",
      issueDate: months(-22),
      state: "verified",
    },
    {
      key: "ysolde-loto",
      technicianKey: "ysolde",
      typeCode: "lockout_tagout",
      issueDate: months(-2),
      state: "verified",
    },
    {
      key: "ysolde-firstaid",
      technicianKey: "ysolde",
      typeCode: "first_aid_cpr",
      issueDate: months(-7),
      state: "verified",
    },
    {
      key: "henrik-osha30",
      technicianKey: "henrik",
      typeCode: "osha_30",
      issueDate: months(-26),
      state: "verified",
    },
    {
      key: "henrik-arc",
      technicianKey: "henrik",
      typeCode: "arc_flash",
      issueDate: months(-9),
      state: "verified",
    },
    {
      key: "henrik-loto",
      technicianKey: "henrik",
      typeCode: "lockout_tagout",
      issueDate: months(-4),
      state: "verified",
    },
    {
      key: "henrik-oem",
      technicianKey: "henrik",
      typeCode: "oem_training",
      issueDate: months(-11),
      state: "verified",
      oem: {
        builder: vantor.name,
        controlFamily: vantor.controls.mill,
        level: 3,
        course: "Advanced Spindle Rebuild",
      },
    },
    {
      key: "henrik-truck",
      technicianKey: "henrik",
      typeCode: "powered_truck",
      issueDate: days(-6),
      submittedOn: days(-2),
      state: "submitted",
    },
    {
      key: "oona-osha10",
      technicianKey: "oona",
      typeCode: "osha_10",
      issueDate: months(-18),
      state: "verified",
    },
    {
      key: "oona-loto",
      technicianKey: "oona",
      typeCode: "lockout_tagout",
      issueDate: days(-10),
      submittedOn: days(-8),
      state: "returned",
      printedName: "O. Trevethen",
      returnReason:
        "The name on the card (O. Trevethen) does not match Oona Trevethan. Upload the card issued in her full name, or a letter from the trainer confirming it.",
    },
    {
      key: "oona-firstaid",
      technicianKey: "oona",
      typeCode: "first_aid_cpr",
      issueDate: months(-11),
      state: "verified",
    },
    {
      key: "oona-oem",
      technicianKey: "oona",
      typeCode: "oem_training",
      issueDate: months(-5),
      state: "verified",
      oem: {
        builder: orrin.name,
        controlFamily: orrin.controls.laser,
        level: 2,
        course: "Resonator and Beam Path Maintenance",
      },
    },
    {
      key: "matthias-osha10",
      technicianKey: "matthias",
      typeCode: "osha_10",
      issueDate: months(-33),
      state: "verified",
    },
    {
      key: "matthias-loto",
      technicianKey: "matthias",
      typeCode: "lockout_tagout",
      issueDate: months(-8),
      state: "verified",
    },
    {
      key: "matthias-truck",
      technicianKey: "matthias",
      typeCode: "powered_truck",
      issueDate: months(-20),
      state: "verified",
    },
    {
      key: "matthias-arc",
      technicianKey: "matthias",
      typeCode: "arc_flash",
      issueDate: months(-30),
      state: "verified",
    },
    {
      key: "saoirse-osha30",
      technicianKey: "saoirse",
      typeCode: "osha_30",
      issueDate: months(-19),
      state: "verified",
    },
    {
      key: "saoirse-arc",
      technicianKey: "saoirse",
      typeCode: "arc_flash",
      issueDate: months(-12),
      state: "verified",
    },
    {
      key: "saoirse-loto",
      technicianKey: "saoirse",
      typeCode: "lockout_tagout",
      issueDate: months(-3),
      state: "verified",
    },
    {
      key: "saoirse-oem",
      technicianKey: "saoirse",
      typeCode: "oem_training",
      issueDate: months(-9),
      expiryDate: months(27),
      state: "verified",
      oem: {
        builder: vantor.name,
        controlFamily: vantor.controls.lathe,
        level: 2,
        course: "Turret and Tailstock Service",
      },
    },
    {
      key: "saoirse-firstaid",
      technicianKey: "saoirse",
      typeCode: "first_aid_cpr",
      issueDate: months(-4),
      state: "verified",
    },
    {
      key: "rafferty-firstaid",
      technicianKey: "rafferty",
      typeCode: "first_aid_cpr",
      issueDate: months(-25),
      state: "lapsed",
    },
    {
      key: "rafferty-loto",
      technicianKey: "rafferty",
      typeCode: "lockout_tagout",
      issueDate: months(-6),
      state: "verified",
    },
    {
      key: "rafferty-oem",
      technicianKey: "rafferty",
      typeCode: "oem_training",
      issueDate: months(-13),
      state: "verified",
      oem: {
        builder: strell.name,
        controlFamily: strell.controls.edm,
        level: 1,
        course: "Wire EDM Operation",
      },
    },
    {
      key: "lucinda-osha10",
      technicianKey: "lucinda",
      typeCode: "osha_10",
      issueDate: months(-28),
      state: "verified",
    },
    {
      key: "lucinda-loto",
      technicianKey: "lucinda",
      typeCode: "lockout_tagout",
      issueDate: months(-9),
      state: "verified",
    },
    {
      key: "lucinda-arc",
      technicianKey: "lucinda",
      typeCode: "arc_flash",
      issueDate: months(-2),
      state: "verified",
    },
    {
      key: "lucinda-oem",
      technicianKey: "lucinda",
      typeCode: "oem_training",
      issueDate: days(-12),
      expiryDate: months(24),
      submittedOn: days(-3),
      state: "submitted",
      oem: {
        builder: halden.name,
        controlFamily: halden.controls.millTurn,
        level: 2,
        course: "Mill-Turn Synchronisation and Service",
      },
    },
  ];
  return specs.map((spec, index) => cardCredential(spec, index, calendar));
}
