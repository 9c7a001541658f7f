import { CERTIFICATE_CAUTION } from "../../shared/directory/schemas.ts";
import type {
  DirectoryTechnicianDto,
  ProfileCredentialDto,
  ProfileReviewDto,
  ProfileStandingDto,
} from "../../shared/directory/directory-shapes.ts";
import { greatCircleDistanceKm } from "../../shared/geo/great-circle-distance.ts";
import type { Requirement } from "../../shared/standing/requirements.ts";
import type { RequirementResult, Standing } from "../../shared/standing/standing-types.ts";
import { preparedRows } from "../db/sql.ts";
import { AppError } from "../http/app-error.ts";
import { assumptions, estimateTrip, ratingSummary, SCORE_SOURCE } from "./estimates.ts";
import { computeStandingNow } from "./live-standing.ts";
import { fieldsForBuyers } from "../../shared/credentials/fields-for-buyers.ts";
import { invitationsInWindowSql, medianOfInvitations } from "../service-requests/index.ts";
import {
  atLeast,
  buyerMayDownload,
  technicianViewLevel,
} from "../../shared/visibility/technician-visibility.ts";

interface CredentialRow {
  id: number;
  type_code: string;
  type_name: string;
  category: string;
  technician_id: number | null;
  fields: Record<string, unknown>;
  decided_at: string | null;
  lapses_at: string | null;
  document_id: number;
}

interface RequirementSetRow {
  id: number;
  name: string;
  site_id: number | null;
  requirements: Requirement[];
  standing: Standing | null;
  earliest_lapse: string | null;
  results: RequirementResult[] | null;
  computed_at: string | null;
}

interface ReviewRow {
  id: number;
  stars: number;
  body: string | null;
  reply: string | null;
  created_at: string | null;
}

interface SiteRow {
  id: number;
  name: string;
  latitude: number;
  longitude: number;
}

interface TechnicianRow {
  id: number;
  name: string;
  company_id: number;
  company_name: string;
  time_zone: string;
  technologies: string[];
  control_families: string[];
  service_radius_km: number;
  hourly_rate_cents: number;
  travel_rate_cents: number;
  mileage_rate_cents: number;
  latitude: number | null;
  longitude: number | null;
  active: boolean;
  /** Stored baseline standing (null = never computed): with `active`, the facts of the shared visibility rule. */
  standing: Standing | null;
  earliest_lapse: Date | null;
  review_count: number;
  star_sum: number;
  // The page's lists, read as JSON arrays in the same statement (timestamps arrive as ISO strings).
  credentials: CredentialRow[];
  requirement_sets: RequirementSetRow[];
  reviews: ReviewRow[];
  sites: SiteRow[];
  roster_technician_entry_id: number | null;
  roster_company_entry_id: number | null;
  invitations: { invited_at: string; first_answer_at: string | null }[];
}

/**
 * The whole page in one round trip, access check included: the technician ($1) with the facts the shared visibility
 * rule decides from (active, stored baseline standing) with, as JSON arrays, the verified credentials in force
 * at $3 (their own and their company's), the standing against each active requirement set of the shop ($2), the
 * latest 100 reviews, the shop's active sites, each in the order the page shows them, and the company's invitations of
 * the response-time window (its median response, by the shared rule).
 */
const PAGE_SQL = `
  SELECT t.id, t.name, t.company_id, c.name AS company_name, c.time_zone, t.technologies, t.control_families,
         t.service_radius_km, t.hourly_rate_cents, t.travel_rate_cents, t.mileage_rate_cents, t.latitude, t.longitude,
         t.active, b.standing, b.earliest_lapse, coalesce(r.review_count, 0)::int AS review_count, coalesce(r.star_sum, 0)::int AS star_sum,
         (SELECT coalesce(json_agg(x ORDER BY x.category, x.type_name, x.id), '[]'::json) FROM (
            SELECT cr.id, cr.type_code, ct.name AS type_name, ct.category, cr.technician_id, cr.fields, cr.decided_at,
                   cr.lapses_at, cr.document_id
              FROM credentials cr JOIN credential_types ct ON ct.code = cr.type_code
             WHERE cr.state = 'verified' AND (cr.lapses_at IS NULL OR cr.lapses_at > $3)
               AND ((cr.company_id = t.company_id AND cr.technician_id IS NULL) OR cr.technician_id = t.id)) x
         ) AS credentials,
         (SELECT coalesce(json_agg(x ORDER BY x.name, x.id), '[]'::json) FROM (
            SELECT rs.id, rs.name, rs.site_id, rs.requirements, s.standing, s.earliest_lapse, s.results, s.computed_at
              FROM requirement_sets rs
              LEFT JOIN technician_standings s ON s.requirement_set_id = rs.id AND s.technician_id = t.id
             WHERE rs.company_id = $2 AND rs.active) x
         ) AS requirement_sets,
         (SELECT coalesce(json_agg(x ORDER BY x.id DESC), '[]'::json) FROM (
            SELECT jr.id, jr.stars, jr.body, jr.reply, jr.created_at FROM job_reviews jr
             WHERE jr.technician_id = t.id ORDER BY jr.id DESC LIMIT 100) x
         ) AS reviews,
         (SELECT coalesce(json_agg(x ORDER BY x.name, x.id), '[]'::json) FROM (
            SELECT si.id, si.name, si.latitude, si.longitude FROM sites si WHERE si.company_id = $2 AND si.active) x
         ) AS sites,
         (SELECT re.id FROM roster_entries re WHERE re.shop_company_id = $2 AND re.technician_id = t.id LIMIT 1)
           AS roster_technician_entry_id,
         (SELECT re.id FROM roster_entries re WHERE re.shop_company_id = $2 AND re.service_company_id = t.company_id LIMIT 1)
           AS roster_company_entry_id,
         ${invitationsInWindowSql("t.company_id", "$3")} AS invitations
    FROM technicians t
    JOIN companies c ON c.id = t.company_id
    LEFT JOIN technician_standings b ON b.technician_id = t.id AND b.requirement_set_id IS NULL
    LEFT JOIN technician_ratings r ON r.technician_id = t.id
   WHERE t.id = $1`;

/**
 * The shared rule on the page's own row: a technician it hides from this buyer (inactive, not cleared, unknown) answers
 * the 404 of a missing id. A work order with the shop only raises "directory" to "contact", so it is not read here.
 */
function mayView(
  buyer: Express.User,
  t: TechnicianRow | undefined,
): t is TechnicianRow & { standing: "cleared" | "lapsing" } {
  if (!t) return false;
  const level = technicianViewLevel(
    {
      role: buyer.role,
      sameCompany: t.company_id === buyer.companyId,
      isSelf: buyer.technicianId !== null && buyer.technicianId === t.id,
      engaged: false,
    },
    { active: t.active, baseline: t.standing },
  );
  return atLeast(level, "directory");
}

function toCredentials(rows: CredentialRow[]): ProfileCredentialDto[] {
  return rows.map((r) => ({
    id: r.id,
    typeCode: r.type_code,
    typeName: r.type_name,
    category: r.category,
    holder: r.technician_id === null ? "company" : "technician",
    fields: fieldsForBuyers(r.fields),
    decidedAt: r.decided_at ? new Date(r.decided_at).toISOString() : null,
    lapsesAt: r.lapses_at ? new Date(r.lapses_at).toISOString() : null,
    // The shared buyer rule decides which documents a shop may download (credentials/policy.ts canReadDocument).
    documentId: buyerMayDownload(r.category) ? r.document_id : null,
  }));
}

async function toStandings(t: TechnicianRow, asOf: Date): Promise<ProfileStandingDto[]> {
  const rows = t.requirement_sets;
  const missing = rows.filter((r) => r.standing === null);
  const live = await computeStandingNow(
    { id: t.id, name: t.name, companyId: t.company_id, timeZone: t.time_zone },
    missing,
    asOf,
  );
  return rows.map((r) => {
    const computed = live.get(r.id);
    const results = computed?.results ?? r.results ?? [];
    return {
      requirementSetId: r.id,
      name: r.name,
      siteId: r.site_id,
      standing: computed?.standing ?? r.standing ?? "not_cleared",
      earliestLapse: computed
        ? computed.earliestLapse
        : r.earliest_lapse
          ? new Date(r.earliest_lapse).toISOString()
          : null,
      computedAt: computed ? asOf.toISOString() : new Date(r.computed_at ?? asOf).toISOString(),
      source: computed ? "computed" : "stored",
      unmet: results
        .filter((x) => x.status === "unmet")
        .map((x) => ({ label: x.requirement.label, reason: x.reason, detail: x.detail })),
      results,
    };
  });
}

const textOf = (v: unknown): string | null => (typeof v === "string" && v.length > 0 ? v : null);

function toReviews(rows: ReviewRow[]): ProfileReviewDto[] {
  return rows.map((j) => ({
    id: Number(j.id),
    stars: Number(j.stars),
    text: textOf(j.body),
    reply: textOf(j.reply),
    createdAt: textOf(j.created_at) ? new Date(String(j.created_at)).toISOString() : null,
  }));
}

function toEstimates(t: TechnicianRow, onSiteHours: number) {
  if (t.latitude === null || t.longitude === null) return [];
  const base = { lat: t.latitude, lon: t.longitude };
  const rates = {
    hourlyRateCents: t.hourly_rate_cents,
    travelRateCents: t.travel_rate_cents,
    mileageRateCents: t.mileage_rate_cents,
  };
  return t.sites.map((site) => {
    const km = greatCircleDistanceKm({ lat: site.latitude, lon: site.longitude }, base);
    const trip = estimateTrip(km, rates, onSiteHours);
    return {
      siteId: site.id,
      siteName: site.name,
      distanceKm: trip.distanceKm,
      distanceMiles: trip.distanceMiles,
      withinServiceRadius: km <= t.service_radius_km,
      roadMiles: trip.roadMiles,
      driveHours: trip.driveHours,
      callOut: trip.callOut,
    };
  });
}

/** The buyer's page of one listed technician: credentials, standing against each of the shop's sets, ratings, estimates. */
export async function findDirectoryTechnician(
  buyer: Express.User,
  technicianId: number,
  onSiteHours: number,
  asOf = new Date(),
  siteId?: number,
): Promise<DirectoryTechnicianDto> {
  const [t] = await preparedRows<TechnicianRow>(PAGE_SQL, [technicianId, buyer.companyId, asOf]);
  if (!mayView(buyer, t)) throw new AppError("not_found", "That record was not found");
  // A set the standing job has not stored yet is computed now (one more query, only then).
  const requirementSets = await toStandings(t, asOf);
  return {
    technicianId: t.id,
    name: t.name,
    companyId: t.company_id,
    companyName: t.company_name,
    technologies: t.technologies,
    controlFamilies: t.control_families,
    serviceRadiusKm: t.service_radius_km,
    hourlyRateCents: t.hourly_rate_cents,
    travelRateCents: t.travel_rate_cents,
    mileageRateCents: t.mileage_rate_cents,
    baseline: {
      standing: t.standing,
      earliestLapse: t.earliest_lapse ? new Date(t.earliest_lapse).toISOString() : null,
    },
    credentials: toCredentials(t.credentials),
    requirementSets,
    rating: ratingSummary(t.review_count, t.star_sum),
    scoreSource: SCORE_SOURCE,
    reviews: toReviews(t.reviews),
    estimates: toEstimates(t, onSiteHours),
    assumptions: assumptions(onSiteHours),
    companyMedianResponseMinutes: medianOfInvitations(t.invitations, asOf),
    roster: {
      technicianEntryId: t.roster_technician_entry_id,
      companyEntryId: t.roster_company_entry_id,
    },
    // Only one of the shop's own active sites counts; any other id is ignored, never echoed.
    chosenSiteId: t.sites.some((s) => s.id === siteId) ? (siteId ?? null) : null,
    caution: CERTIFICATE_CAUTION,
  };
}
