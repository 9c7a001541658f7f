import type { Role } from "../accounts/schemas.ts";
import {
  atLeast,
  buyerMayDownload,
  buyerMayReadField,
  mayReadTechnicianReviews,
  PUBLIC_REVIEW_FIELDS,
  technicianViewLevel,
  type TechnicianFacts,
  type TechnicianViewLevel,
  type ViewerFacts,
} from "./technician-visibility.ts";

interface Scenario {
  /** Who, among the callers of this role, the scenario stands for. */
  label: string;
  viewer: Omit<ViewerFacts, "role">;
}

const nobody = { sameCompany: false, isSelf: false, engaged: false };

// The callers of each role the table tells apart; a cell lists the ones the rule lets through.
const SCENARIOS: Record<Role, Scenario[]> = {
  buyer: [
    { label: "any shop", viewer: nobody },
    {
      label: "a shop whose work order the technician accepted (completed, disputed, confirmed)",
      viewer: { ...nobody, engaged: true },
    },
  ],
  provider_admin: [
    { label: "of its own technicians", viewer: { ...nobody, sameCompany: true } },
    { label: "another company's", viewer: nobody },
  ],
  technician: [
    { label: "their own", viewer: { ...nobody, sameCompany: true, isSelf: true } },
    { label: "a colleague's", viewer: { ...nobody, sameCompany: true } },
    { label: "another company's", viewer: nobody },
  ],
  reviewer: [{ label: "any", viewer: nobody }],
  admin: [{ label: "any", viewer: nobody }],
};

const LISTED: TechnicianFacts = { active: true, baseline: "cleared" };
const HIDDEN: TechnicianFacts[] = [
  { active: true, baseline: "not_cleared" },
  { active: true, baseline: null },
  { active: false, baseline: "cleared" },
];

interface Row {
  what: string;
  /** The technicians the row is about; a scenario passes only if the rule lets it through for each of them. */
  technicians: TechnicianFacts[];
  allows: (role: Role, level: TechnicianViewLevel) => boolean;
}

const ownRecordsOr = (buyerRule: boolean) => (role: Role, level: TechnicianViewLevel) =>
  role === "buyer" ? buyerRule && atLeast(level, "directory") : level === "full";

const ROWS: Row[] = [
  {
    what: "Directory profile of a listed technician (name, company, technologies, controls, radius, rates)",
    technicians: [LISTED],
    allows: (_role, level) => atLeast(level, "directory"),
  },
  {
    what: "Contact details (e-mail, phone, ZIP code, exact location)",
    technicians: [LISTED],
    allows: (_role, level) => atLeast(level, "contact"),
  },
  {
    what: "Whether the record is active and has a sign-in",
    technicians: [LISTED],
    allows: (_role, level) => level === "full",
  },
  {
    what: "Anything of an inactive or not cleared technician (otherwise the 404 of a missing id)",
    technicians: HIDDEN,
    allows: (_role, level) => atLeast(level, "directory"),
  },
  {
    what: "A technician's review list: stars, words, the company's reply, date",
    technicians: [LISTED],
    allows: (_role, level) => mayReadTechnicianReviews(level),
  },
  {
    what: "On that list, who wrote each review (shop, author, work order)",
    technicians: [LISTED],
    allows: (_role, level) =>
      mayReadTechnicianReviews(level) &&
      (["shopName", "authorName", "workOrderId"] as const).some((f) =>
        (PUBLIC_REVIEW_FIELDS as readonly string[]).includes(f),
      ),
  },
  {
    what: "Policy numbers, limits and dates of verified credentials",
    technicians: [LISTED],
    allows: ownRecordsOr(buyerMayReadField("policyNumber") && buyerMayReadField("limits")),
  },
  {
    what: "Names and card numbers on training cards, exemption certificate numbers, certificate holders (also in standing snapshots and printable proof)",
    technicians: [LISTED],
    allows: ownRecordsOr(
      buyerMayReadField("cardNumber") ||
        buyerMayReadField("holderName") ||
        buyerMayReadField("certificateHolder"),
    ),
  },
  {
    what: "Files of verified certificates of insurance",
    technicians: [LISTED],
    allows: ownRecordsOr(buyerMayDownload("insurance")),
  },
  {
    what: "Files of training cards, machine-builder certificates and licences",
    technicians: [LISTED],
    allows: ownRecordsOr(
      buyerMayDownload("safety") || buyerMayDownload("oem") || buyerMayDownload("license"),
    ),
  },
];

export const VISIBILITY_COLUMNS: { role: Role; heading: string }[] = [
  { role: "buyer", heading: "shop (buyer)" },
  { role: "provider_admin", heading: "service company (provider_admin)" },
  { role: "technician", heading: "technician" },
  { role: "reviewer", heading: "reviewer" },
  { role: "admin", heading: "admin" },
];

function cell(row: Row, role: Role): string {
  const scenarios = SCENARIOS[role];
  const allowed = scenarios.filter((s) =>
    row.technicians.every((t) => row.allows(role, technicianViewLevel({ role, ...s.viewer }, t))),
  );
  if (allowed.length === scenarios.length) return "yes";
  if (allowed.length === 0) return "no";
  return `only ${allowed.map((s) => s.label).join(", ")}`;
}

/** The README's table of who sees what, rendered from the rule itself so the two cannot drift apart. */
export function renderVisibilityTable(): string {
  const head = `| what | ${VISIBILITY_COLUMNS.map((c) => c.heading).join(" | ")} |`;
  const rule = `|---|${VISIBILITY_COLUMNS.map(() => "---").join("|")}|`;
  const body = ROWS.map(
    (row) => `| ${row.what} | ${VISIBILITY_COLUMNS.map((c) => cell(row, c.role)).join(" | ")} |`,
  );
  return [head, rule, ...body].join("\n");
}
