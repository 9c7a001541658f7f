import { z } from "zod";
import { singleLineText } from "../api/text.ts";
import { idParam } from "../credentials/schemas.ts";
import { machineTechnologies } from "../technicians/schemas.ts";
import type { Standing, UnmetReason, RequirementResult } from "../standing/standing-types.ts";
import { DEFAULT_ON_SITE_HOURS, type CallOutEstimate } from "./call-out-estimate.ts";

/** An empty query-string value ("?q=") means "no filter", not zero. */
const optional = <T extends z.ZodType>(schema: T) =>
  z.preprocess((v) => (v === "" ? undefined : v), schema.optional());

const dollars = z.coerce.number().int().min(0).max(1_000_000_000);

export const directorySorts = ["distance", "score", "hourlyRate", "soonestLapse"] as const;
export type DirectorySort = (typeof directorySorts)[number];

/**
 * Buyer's search radius in miles when a site is chosen and no radius is given. The radius is the one distance a person
 * types and bookmarks, so the query string carries it in miles (`radiusMiles`); the server converts it once
 * (shared/geo/units.ts) and answers distances in kilometres (`distanceKm`, `serviceRadiusKm`), which clients show in miles.
 */
export const DEFAULT_RADIUS_MILES = 100;
export const MAX_RADIUS_MILES = 1200;
export const MAX_PAGE_SIZE = 50;

/**
 * The directory's query string. Every parameter is optional; `radiusMiles` applies only with a `siteId`. Lists are comma
 * separated (`credentialTypes=arc_flash,lockout_tagout`), so a search fits in a bookmarkable URL.
 */
export const directoryQuerySchema = z.object({
  credentialTypes: optional(
    singleLineText()
      .transform((v) => [
        ...new Set(
          v
            .split(",")
            .map((s) => s.trim())
            .filter(Boolean),
        ),
      ])
      .pipe(z.array(singleLineText().regex(/^[a-z][a-z0-9_]{1,39}$/, "Unknown credential type")).max(12)),
  ),
  oemBuilder: optional(singleLineText().trim().min(1).max(120)),
  controlFamily: optional(singleLineText().trim().min(1).max(120)),
  minOemLevel: optional(z.coerce.number().int().min(1).max(3)),
  technology: optional(z.enum(machineTechnologies)),
  minEachOccurrence: optional(dollars),
  minAggregate: optional(dollars),
  minAutoCsl: optional(dollars),
  requirementSetId: optional(idParam),
  siteId: optional(idParam),
  radiusMiles: optional(z.coerce.number().positive().max(MAX_RADIUS_MILES)),
  minRating: optional(z.coerce.number().min(1).max(5)),
  q: optional(singleLineText().trim().min(1).max(100)),
  equipmentId: optional(idParam),
  sort: optional(z.enum(directorySorts)),
  cursor: optional(singleLineText().max(400)),
  limit: z.preprocess(
    (v) => (v === "" ? undefined : v),
    z.coerce.number().int().min(1).max(MAX_PAGE_SIZE).default(20),
  ),
  onSiteHours: z.preprocess(
    (v) => (v === "" ? undefined : v),
    z.coerce.number().min(0).max(24).default(DEFAULT_ON_SITE_HOURS),
  ),
});
export type DirectoryQuery = z.infer<typeof directoryQuerySchema>;

/**
 * Filter groups as the empty state names them. `oemTraining` = oemBuilder + controlFamily + minOemLevel (one credential
 * must match all three); `generalLiability` = minEachOccurrence + minAggregate (one policy); `autoLiability` = minAutoCsl;
 * `distance` = siteId + radiusMiles together with the technician's own service radius.
 */
export const directoryFilterNames = [
  "credentialTypes",
  "oemTraining",
  "technology",
  "generalLiability",
  "autoLiability",
  "requirementSetId",
  "distance",
  "minRating",
  "q",
] as const;
export type DirectoryFilterName = (typeof directoryFilterNames)[number];

export interface RatingSummaryDto {
  count: number;
  /** Mean stars, null without ratings. */
  average: number | null;
  /** The sort score (see `scoreSource`). */
  score: number;
}

/** One line of the chosen requirement set: "General liability", met by "GL $1M + umbrella $4M each occurrence". */
export interface RequirementMetDto {
  label: string;
  /** Short "how": the stacked limits or the credential; null when the stored standing predates it. */
  metBy: string | null;
  /** The engine's sentence, e.g. "Met by Commercial general liability GL-4471 until Jul 15, 2027." */
  detail: string;
  lapsing: boolean;
}

export interface DirectoryRowDto {
  technicianId: number;
  name: string;
  companyId: number;
  companyName: string;
  technologies: string[];
  controlFamilies: string[];
  serviceRadiusKm: number;
  /** Straight-line distance to the chosen site; null without a site. */
  distanceKm: number | null;
  distanceMiles: number | null;
  /** Estimated one-way road miles and drive hours (see `assumptions`); null without a site. */
  roadMiles: number | null;
  driveHours: number | null;
  callOut: CallOutEstimate | null;
  rating: RatingSummaryDto;
  standing: Extract<Standing, "cleared" | "lapsing">;
  earliestLapse: string | null;
  /** With a requirement set chosen: how each of its lines is met, from the stored standing; null without a set. */
  requirementsMet: RequirementMetDto[] | null;
  /** On the caller's roster: by its own entry, through its company's entry, or not at all. */
  onRoster: "technician" | "company" | null;
  hourlyRateCents: number;
  travelRateCents: number;
  mileageRateCents: number;
}

export interface DirectoryAssumptionsDto {
  earthRadiusKm: number;
  roadFactor: number;
  averageSpeedMph: number;
  onSiteHours: number;
}

export interface DirectoryPageDto {
  rows: DirectoryRowDto[];
  /** Opaque; pass back as `cursor` for the next page. Null on the last page. */
  nextCursor: string | null;
  sort: DirectorySort;
  /** On an empty first page: the filter that removed the most candidates and how many it removed. */
  emptyReason: { filter: DirectoryFilterName; removed: number } | null;
  /** Technology and control family filled from `equipmentId` (explicit parameters win). */
  fromEquipment: { technology: string; controlFamily: string; builder?: string } | null;
  scoreSource: string;
  assumptions: DirectoryAssumptionsDto;
  /**
   * What the rows' standing was judged against: the shop's requirement set (asked for, or the chosen site's own
   * set when none was asked for), or only the platform baseline, which covers the company's insurance and nothing
   * the technician carries.
   */
  judgedAgainst: JudgedAgainstDto;
}

export type JudgedAgainstDto =
  | { kind: "requirement_set"; requirementSetId: number; name: string; fromSite: boolean }
  | { kind: "baseline" };

export interface ProfileCredentialDto {
  id: number;
  typeCode: string;
  typeName: string;
  category: string;
  holder: "company" | "technician";
  /** Dates, limits and training details only; no storage keys or extracted text. */
  fields: Record<string, unknown>;
  decidedAt: string | null;
  lapsesAt: string | null;
  /** GET /api/documents/:documentId/file; set only for verified insurance certificates. */
  documentId: number | null;
}

export interface ProfileStandingDto {
  requirementSetId: number;
  name: string;
  siteId: number | null;
  standing: Standing;
  earliestLapse: string | null;
  computedAt: string;
  /** `stored` = the last computed standing; `computed` = computed now because none was stored yet. */
  source: "stored" | "computed";
  unmet: { label: string; reason: UnmetReason | null; detail: string }[];
  results: RequirementResult[];
}

export interface ProfileReviewDto {
  id: number;
  stars: number;
  text: string | null;
  reply: string | null;
  createdAt: string | null;
}

export interface SiteEstimateDto {
  siteId: number;
  siteName: string;
  distanceKm: number;
  distanceMiles: number;
  /** False when the site lies outside the technician's own service radius. */
  withinServiceRadius: boolean;
  roadMiles: number;
  driveHours: number;
  callOut: CallOutEstimate;
}

export interface DirectoryTechnicianDto {
  technicianId: number;
  name: string;
  companyId: number;
  companyName: string;
  technologies: string[];
  controlFamilies: string[];
  serviceRadiusKm: number;
  hourlyRateCents: number;
  travelRateCents: number;
  mileageRateCents: number;
  baseline: { standing: Extract<Standing, "cleared" | "lapsing">; earliestLapse: string | null };
  credentials: ProfileCredentialDto[];
  requirementSets: ProfileStandingDto[];
  rating: RatingSummaryDto;
  scoreSource: string;
  reviews: ProfileReviewDto[];
  estimates: SiteEstimateDto[];
  assumptions: DirectoryAssumptionsDto;
  /** The company's median minutes from a service-request invitation to its first answer, last 90 days. */
  companyMedianResponseMinutes: number | null;
  /** The caller's roster entries that cover this technician: its own and its company's (null when absent). */
  roster: { technicianEntryId: number | null; companyEntryId: number | null };
  /** The site the estimates were asked for (carried from the directory), when it is one of the shop's sites. */
  chosenSiteId: number | null;
  caution: string;
}

export const technicianProfileQuerySchema = z.object({
  onSiteHours: z.preprocess(
    (v) => (v === "" ? undefined : v),
    z.coerce.number().min(0).max(24).default(DEFAULT_ON_SITE_HOURS),
  ),
  siteId: optional(idParam),
});

/** Shown beside every certificate and estimate. */
export const CERTIFICATE_CAUTION =
  "A certificate of insurance is information only and confers no rights; confirm coverage with the insurer or broker. " +
  "Follow local codes, site safety rules and licensed practice. Estimates are before tax.";
