import { z } from "zod";
import { directoryFilterNames, directorySorts } from "@shared/directory/schemas.ts";
import { requirementStatuses, standings, unmetReasons } from "@shared/standing/standing-types.ts";

// Run-time checks of shared/directory/schemas.ts (DirectoryPageDto, DirectoryTechnicianDto); only what pages show is required.
export const callOutSchema = z.object({
  travelCents: z.number(),
  labourCents: z.number(),
  mileageCents: z.number(),
  totalCents: z.number(),
});
export type CallOut = z.infer<typeof callOutSchema>;

const ratingSchema = z.object({ count: z.number(), average: z.number().nullable(), score: z.number() });
export type RatingSummary = z.infer<typeof ratingSchema>;

const assumptionsSchema = z.object({
  earthRadiusKm: z.number(),
  roadFactor: z.number(),
  averageSpeedMph: z.number(),
  onSiteHours: z.number(),
});
export type DirectoryAssumptions = z.infer<typeof assumptionsSchema>;

const cleared = z.enum(["cleared", "lapsing"]);

export const directoryRowSchema = z.object({
  technicianId: z.number(),
  name: z.string(),
  companyId: z.number(),
  companyName: z.string(),
  technologies: z.array(z.string()),
  controlFamilies: z.array(z.string()),
  serviceRadiusKm: z.number(),
  distanceKm: z.number().nullable(),
  distanceMiles: z.number().nullable(),
  roadMiles: z.number().nullable(),
  driveHours: z.number().nullable(),
  callOut: callOutSchema.nullable(),
  rating: ratingSchema,
  standing: cleared,
  earliestLapse: z.string().nullable(),
  requirementsMet: z
    .array(
      z.object({ label: z.string(), metBy: z.string().nullable(), detail: z.string(), lapsing: z.boolean() }),
    )
    .nullable(),
  onRoster: z.enum(["technician", "company"]).nullable(),
  hourlyRateCents: z.number(),
  travelRateCents: z.number(),
  mileageRateCents: z.number(),
});
export type DirectoryRow = z.infer<typeof directoryRowSchema>;

export const judgedAgainstSchema = z.discriminatedUnion("kind", [
  z.object({
    kind: z.literal("requirement_set"),
    requirementSetId: z.number(),
    name: z.string(),
    fromSite: z.boolean(),
  }),
  z.object({ kind: z.literal("baseline") }),
]);
export type JudgedAgainst = z.infer<typeof judgedAgainstSchema>;

export const directoryPageSchema = z.object({
  rows: z.array(directoryRowSchema),
  nextCursor: z.string().nullable(),
  sort: z.enum(directorySorts),
  emptyReason: z.object({ filter: z.enum(directoryFilterNames), removed: z.number() }).nullable(),
  fromEquipment: z.object({ technology: z.string(), controlFamily: z.string() }).nullable(),
  scoreSource: z.string(),
  assumptions: assumptionsSchema,
  judgedAgainst: judgedAgainstSchema,
});
export type DirectoryPage = z.infer<typeof directoryPageSchema>;

const profileCredentialSchema = z.object({
  id: z.number(),
  typeCode: z.string(),
  typeName: z.string(),
  category: z.string(),
  holder: z.enum(["company", "technician"]),
  fields: z.record(z.string(), z.unknown()),
  decidedAt: z.string().nullable(),
  lapsesAt: z.string().nullable(),
  documentId: z.number().nullable(),
});
export type ProfileCredential = z.infer<typeof profileCredentialSchema>;

const profileStandingSchema = z.object({
  requirementSetId: z.number(),
  name: z.string(),
  siteId: z.number().nullable(),
  standing: z.enum(standings),
  earliestLapse: z.string().nullable(),
  computedAt: z.string(),
  unmet: z.array(
    z.object({ label: z.string(), reason: z.enum(unmetReasons).nullable(), detail: z.string() }),
  ),
  results: z.array(
    z
      .object({
        requirement: z.object({ label: z.string() }).loose(),
        status: z.enum(requirementStatuses),
        detail: z.string(),
        lapsesAt: z.string().nullable(),
        // Standings stored before stacked limits were described carry no metBy.
        metBy: z.string().nullable().optional(),
      })
      .loose(),
  ),
});
export type ProfileStanding = z.infer<typeof profileStandingSchema>;

const siteEstimateSchema = z.object({
  siteId: z.number(),
  siteName: z.string(),
  distanceKm: z.number(),
  distanceMiles: z.number(),
  withinServiceRadius: z.boolean(),
  roadMiles: z.number(),
  driveHours: z.number(),
  callOut: callOutSchema,
});
export type SiteEstimate = z.infer<typeof siteEstimateSchema>;

export const directoryTechnicianSchema = z.object({
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
  baseline: z.object({ standing: cleared, earliestLapse: z.string().nullable() }),
  credentials: z.array(profileCredentialSchema),
  requirementSets: z.array(profileStandingSchema),
  rating: ratingSchema,
  scoreSource: z.string(),
  reviews: z.array(
    z.object({
      id: z.number(),
      stars: z.number(),
      text: z.string().nullable(),
      reply: z.string().nullable(),
      createdAt: z.string().nullable(),
    }),
  ),
  estimates: z.array(siteEstimateSchema),
  assumptions: assumptionsSchema,
  roster: z.object({ technicianEntryId: z.number().nullable(), companyEntryId: z.number().nullable() }),
  chosenSiteId: z.number().nullable(),
  caution: z.string(),
});
export type DirectoryTechnician = z.infer<typeof directoryTechnicianSchema>;
