import { z } from "zod";
import { credentialHolders } from "../credentials/catalogue.ts";
import { requirementResultSchema } from "../standing/schemas.ts";
import { standings, unmetReasons } from "../standing/standing-types.ts";
import { directoryFilterNames, directorySorts } from "./schemas.ts";

// Response shapes of the directory: the server's DTO types are inferred from these and the client parses its answers
// with them. Distances are kilometres (`distanceKm`, `serviceRadiusKm`) with miles beside them where a page shows them.

/** The directory lists only technicians in force against the platform baseline. */
const listedStanding = z.enum(["cleared", "lapsing"]);

/** What a technician sells: shared by a directory row and the profile. */
const offerShape = {
  technicianId: z.number(),
  name: z.string(),
  companyId: z.number(),
  companyName: z.string(),
  technologies: z.array(z.string()),
  controlFamilies: z.array(z.string()),
  serviceRadiusKm: z.number(),
  hourlyRateCents: z.number(),
  travelRateCents: z.number(),
  mileageRateCents: z.number(),
};

/** shared/directory/call-out-estimate.ts estimateCallOut: each line in whole cents, the total their sum. */
export const callOutEstimateDtoSchema = z.object({
  travelCents: z.number(),
  labourCents: z.number(),
  mileageCents: z.number(),
  totalCents: z.number(),
});
export type CallOutEstimateDto = z.infer<typeof callOutEstimateDtoSchema>;

export const ratingSummaryDtoSchema = z.object({
  count: z.number(),
  /** Mean stars, null without ratings. */
  average: z.number().nullable(),
  /** The sort score (see `scoreSource`). */
  score: z.number(),
});
export type RatingSummaryDto = z.infer<typeof ratingSummaryDtoSchema>;

/** One line of the chosen requirement set: "General liability", met by "GL $1M + umbrella $4M each occurrence". */
export const requirementMetDtoSchema = z.object({
  label: z.string(),
  /** Short "how": the stacked limits or the credential; null when the stored standing predates it. */
  metBy: z.string().nullable(),
  /** The engine's sentence, e.g. "Met by Commercial general liability GL-4471 until Jul 15, 2027." */
  detail: z.string(),
  lapsing: z.boolean(),
});
export type RequirementMetDto = z.infer<typeof requirementMetDtoSchema>;

export const directoryRowDtoSchema = z.object({
  ...offerShape,
  /** Straight-line distance to the chosen site; null without a site. */
  distanceKm: z.number().nullable(),
  distanceMiles: z.number().nullable(),
  /** Estimated one-way road miles and drive hours (see `assumptions`); null without a site. */
  roadMiles: z.number().nullable(),
  driveHours: z.number().nullable(),
  callOut: callOutEstimateDtoSchema.nullable(),
  rating: ratingSummaryDtoSchema,
  standing: listedStanding,
  earliestLapse: z.string().nullable(),
  /** With a requirement set chosen: how each of its lines is met, from the stored standing; null without a set. */
  requirementsMet: z.array(requirementMetDtoSchema).nullable(),
  /** On the caller's roster: by its own entry, through its company's entry, or not at all. */
  onRoster: z.enum(["technician", "company"]).nullable(),
});
export type DirectoryRowDto = z.infer<typeof directoryRowDtoSchema>;

export const directoryAssumptionsDtoSchema = z.object({
  earthRadiusKm: z.number(),
  roadFactor: z.number(),
  averageSpeedMph: z.number(),
  onSiteHours: z.number(),
});
export type DirectoryAssumptionsDto = z.infer<typeof directoryAssumptionsDtoSchema>;

/**
 * What the rows' standing was judged against: the shop's requirement set (asked for, or the chosen site's own set when
 * none was asked for), or only the platform baseline, which covers the company's insurance and nothing the technician
 * carries.
 */
export const judgedAgainstDtoSchema = z.discriminatedUnion("kind", [
  z.object({
    kind: z.literal("requirement_set"),
    requirementSetId: z.number(),
    name: z.string(),
    fromSite: z.boolean(),
  }),
  z.object({ kind: z.literal("baseline") }),
]);
export type JudgedAgainstDto = z.infer<typeof judgedAgainstDtoSchema>;

export const directoryPageDtoSchema = z.object({
  rows: z.array(directoryRowDtoSchema),
  /** Opaque; pass back as `cursor` for the next page. Null on the last page. */
  nextCursor: z.string().nullable(),
  sort: z.enum(directorySorts),
  /** On an empty first page: the filter that removed the most candidates and how many it removed. */
  emptyReason: z.object({ filter: z.enum(directoryFilterNames), removed: z.number() }).nullable(),
  /** Technology and control family filled from `equipmentId` (explicit parameters win). */
  fromEquipment: z
    .object({ technology: z.string(), controlFamily: z.string(), builder: z.string().optional() })
    .nullable(),
  scoreSource: z.string(),
  assumptions: directoryAssumptionsDtoSchema,
  judgedAgainst: judgedAgainstDtoSchema,
});
export type DirectoryPageDto = z.infer<typeof directoryPageDtoSchema>;

export const profileCredentialDtoSchema = z.object({
  id: z.number(),
  typeCode: z.string(),
  typeName: z.string(),
  category: z.string(),
  holder: z.enum(credentialHolders),
  /** Dates, limits and training details only (shared/credentials/fields-for-buyers.ts); they differ by type. */
  fields: z.record(z.string(), z.unknown()),
  decidedAt: z.string().nullable(),
  lapsesAt: z.string().nullable(),
  /** GET /api/documents/:documentId/file; set only for verified insurance certificates. */
  documentId: z.number().nullable(),
});
export type ProfileCredentialDto = z.infer<typeof profileCredentialDtoSchema>;

export const profileStandingDtoSchema = z.object({
  requirementSetId: z.number(),
  name: z.string(),
  siteId: z.number().nullable(),
  standing: z.enum(standings),
  earliestLapse: z.string().nullable(),
  computedAt: z.string(),
  /** `stored` = the last computed standing; `computed` = computed now because none was stored yet. */
  source: z.enum(["stored", "computed"]),
  unmet: z.array(
    z.object({ label: z.string(), reason: z.enum(unmetReasons).nullable(), detail: z.string() }),
  ),
  results: z.array(requirementResultSchema),
});
export type ProfileStandingDto = z.infer<typeof profileStandingDtoSchema>;

export const profileReviewDtoSchema = z.object({
  id: z.number(),
  stars: z.number(),
  text: z.string().nullable(),
  reply: z.string().nullable(),
  createdAt: z.string().nullable(),
});
export type ProfileReviewDto = z.infer<typeof profileReviewDtoSchema>;

export const siteEstimateDtoSchema = z.object({
  siteId: z.number(),
  siteName: z.string(),
  distanceKm: z.number(),
  distanceMiles: z.number(),
  /** False when the site lies outside the technician's own service radius. */
  withinServiceRadius: z.boolean(),
  roadMiles: z.number(),
  driveHours: z.number(),
  callOut: callOutEstimateDtoSchema,
});
export type SiteEstimateDto = z.infer<typeof siteEstimateDtoSchema>;

export const directoryTechnicianDtoSchema = z.object({
  ...offerShape,
  baseline: z.object({ standing: listedStanding, earliestLapse: z.string().nullable() }),
  credentials: z.array(profileCredentialDtoSchema),
  requirementSets: z.array(profileStandingDtoSchema),
  rating: ratingSummaryDtoSchema,
  scoreSource: z.string(),
  reviews: z.array(profileReviewDtoSchema),
  estimates: z.array(siteEstimateDtoSchema),
  assumptions: directoryAssumptionsDtoSchema,
  /** The company's median minutes from a service-request invitation to its first answer, last 90 days. */
  companyMedianResponseMinutes: z.number().nullable(),
  /** The caller's roster entries that cover this technician: its own and its company's (null when absent). */
  roster: z.object({ technicianEntryId: z.number().nullable(), companyEntryId: z.number().nullable() }),
  /** The site the estimates were asked for (carried from the directory), when it is one of the shop's sites. */
  chosenSiteId: z.number().nullable(),
  caution: z.string(),
});
export type DirectoryTechnicianDto = z.infer<typeof directoryTechnicianDtoSchema>;
