import { z } from "zod";
import { singleLineText } from "../api/text.ts";
import { idParam } from "../credentials/schemas.ts";
import { machineTechnologies } from "../technicians/schemas.ts";
import { DEFAULT_ON_SITE_HOURS } from "./call-out-estimate.ts";

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
