import type { Role } from "../accounts/schemas.ts";
import type { Standing } from "../standing/standing-types.ts";
import type { WorkOrderStatus } from "../work-orders/schemas.ts";
import { fieldsForBuyers } from "../credentials/fields-for-buyers.ts";
import type { StandingSnapshot } from "../work-orders/standing-snapshot.ts";

/**
 * How much of a technician a caller may see, weakest first:
 * - none: nothing at all; the answer is the 404 of a missing id, so a hidden technician is indistinguishable from none.
 * - directory: the profile the directory shows shops (name, company, technologies, controls, radius, rates).
 * - contact: the profile plus the ways to reach them (e-mail, phone, ZIP code, exact location).
 * - full: every field, including whether the record is active and has a sign-in.
 */
export const technicianViewLevels = ["none", "directory", "contact", "full"] as const;
export type TechnicianViewLevel = (typeof technicianViewLevels)[number];

/** A work order in one of these states means the technician took the shop's job: only then does the shop get contact. */
export const ENGAGED_WORK_ORDER_STATUSES = [
  "accepted",
  "completed",
  "disputed",
  "confirmed",
] as const satisfies readonly WorkOrderStatus[];

export interface TechnicianFacts {
  active: boolean;
  /** Stored baseline standing; null = never computed (treated as not cleared). */
  baseline: Standing | null;
}

export interface ViewerFacts {
  role: Role;
  /** The caller's company employs the technician. */
  sameCompany: boolean;
  /** The caller is this technician. */
  isSelf: boolean;
  /** The caller's shop has a work order with this technician in an engaged state. */
  engaged: boolean;
}

/** Listed = shown in the directory: active, and cleared or lapsing (still in force) against the platform baseline. */
export function isListed(t: TechnicianFacts): boolean {
  return t.active && (t.baseline === "cleared" || t.baseline === "lapsing");
}

/** The one rule: what this caller may see of this technician. */
export function technicianViewLevel(viewer: ViewerFacts, technician: TechnicianFacts): TechnicianViewLevel {
  switch (viewer.role) {
    case "reviewer":
    case "admin":
      return "full";
    case "provider_admin":
      return viewer.sameCompany ? "full" : "none";
    case "technician":
      return viewer.isSelf ? "full" : "none";
    case "buyer":
      if (!isListed(technician)) return "none";
      return viewer.engaged ? "contact" : "directory";
  }
}

export function atLeast(level: TechnicianViewLevel, floor: TechnicianViewLevel): boolean {
  return technicianViewLevels.indexOf(level) >= technicianViewLevels.indexOf(floor);
}

const DIRECTORY_FIELDS = [
  "id",
  "companyId",
  "companyName",
  "name",
  "technologies",
  "controlFamilies",
  "serviceRadiusKm",
  "hourlyRateCents",
  "travelRateCents",
  "mileageRateCents",
] as const;
const CONTACT_FIELDS = [
  ...DIRECTORY_FIELDS,
  "email",
  "phone",
  "postalCode",
  "latitude",
  "longitude",
] as const;
const FULL_FIELDS = [...CONTACT_FIELDS, "active", "hasAccount"] as const;

/** The fields of a technician record each level may read. */
export const TECHNICIAN_FIELDS_BY_LEVEL = {
  none: [],
  directory: DIRECTORY_FIELDS,
  contact: CONTACT_FIELDS,
  full: FULL_FIELDS,
} as const satisfies Record<TechnicianViewLevel, readonly string[]>;

export type TechnicianField = (typeof FULL_FIELDS)[number];

/** Keeps only the fields the level may read; a field the level does not list never leaves the server. */
export function pickTechnicianFields<T extends Partial<Record<TechnicianField, unknown>>>(
  record: T,
  level: Exclude<TechnicianViewLevel, "none">,
): Partial<T> {
  const allowed: readonly string[] = TECHNICIAN_FIELDS_BY_LEVEL[level];
  return Object.fromEntries(Object.entries(record).filter(([key]) => allowed.includes(key))) as Partial<T>;
}

/** Reviews as anyone outside the job reads them: stars, words, the company's reply and the date; never who wrote it. */
export const PUBLIC_REVIEW_FIELDS = ["id", "stars", "text", "reply", "createdAt"] as const;

/** Who may read a technician's public reviews: whoever may see the technician's directory profile. */
export function mayReadTechnicianReviews(level: TechnicianViewLevel): boolean {
  return atLeast(level, "directory");
}

/**
 * Credential documents a buyer may download: certificates of insurance only (a shop checks its vendor's coverage on
 * the certificate itself). Training cards and licences carry the holder's name and card number, which buyers never get.
 */
export const BUYER_DOWNLOADABLE_CATEGORIES: readonly string[] = ["insurance"];

export function buyerMayDownload(category: string): boolean {
  return BUYER_DOWNLOADABLE_CATEGORIES.includes(category);
}

/** A credential field a buyer may read (the same list the technician page uses). */
export function buyerMayReadField(field: string): boolean {
  return Object.keys(fieldsForBuyers({ [field]: true })).length === 1;
}

/**
 * A standing snapshot as a shop reads it: the document number appears only when it is a field buyers may read
 * (a policy or licence number, never a card or exemption certificate number). A snapshot stored before the field was
 * recorded shows no number to the shop.
 */
export function snapshotForBuyer(snapshot: StandingSnapshot): StandingSnapshot {
  return {
    ...snapshot,
    targets: snapshot.targets.map((t) => ({
      ...t,
      requirements: t.requirements.map((r) => {
        if (!r.credential) return r;
        const field = r.credential.referenceField;
        const shown = field !== undefined && field !== null && buyerMayReadField(field);
        return {
          ...r,
          credential: { ...r.credential, reference: shown ? r.credential.reference : null },
        };
      }),
    })),
  };
}
