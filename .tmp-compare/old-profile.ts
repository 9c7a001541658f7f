import { QueryTypes } from "sequelize";
import {
  CERTIFICATE_CAUTION,
  type DirectoryTechnicianDto,
  type ProfileCredentialDto,
  type ProfileReviewDto,
  type ProfileStandingDto,
} from "/work/main/shared/directory/schemas.ts";
import { greatCircleDistanceKm } from "/work/main/shared/geo/great-circle-distance.ts";
import type { Requirement } from "/work/main/shared/standing/requirements.ts";
import type { RequirementResult, Standing } from "/work/main/shared/standing/standing-types.ts";
import { db } from "/work/main/server/db/sequelize.ts";
import { AppError } from "/work/main/server/http/app-error.ts";
import { Site } from "/work/main/server/sites/index.ts";
import { assumptions, estimateTrip, ratingSummary, SCORE_SOURCE } from "/work/main/server/directory/estimates.ts";
import { computeStandingNow } from "/work/main/server/directory/live-standing.ts";

const select = <T extends object>(sql: string, bind: unknown[]) =>
  db().query<T>(sql, { bind, type: QueryTypes.SELECT });

// What a buyer may read of a credential's fields: dates, limits, flags and training details, never holder contact data.
const FIELDS_FOR_BUYERS = new Set([
  "insurerName",
  "naic",
  "policyNumber",
  "effectiveDate",
  "expirationDate",
  "limits",
  "additionalInsured",
  "waiverOfSubrogation",
  "statutory",
  "course",
  "issueDate",
  "expiryDate",
  "builder",
  "controlFamily",
  "level",
  "trainer",
  "licenseNumber",
  "issuingAuthority",
  "state",
]);

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
  standing: "cleared" | "lapsing";
  earliest_lapse: Date | null;
  review_count: number;
  star_sum: number;
}

/** Listed = active with a stored baseline standing of cleared or lapsing; anyone else is not shown to buyers. */
export async function isListedTechnician(technicianId: number): Promise<boolean> {
  const rows = await select<{ id: number }>(
    `SELECT t.id FROM technicians t JOIN technician_standings b ON b.technician_id = t.id AND b.requirement_set_id IS NULL
      WHERE t.id = $1 AND t.active AND b.standing IN ('cleared','lapsing')`,
    [technicianId],
  );
  return rows.length > 0;
}

async function loadCredentials(t: TechnicianRow, asOf: Date): Promise<ProfileCredentialDto[]> {
  const rows = await select<{
    id: number;
    type_code: string;
    type_name: string;
    category: string;
    technician_id: number | null;
    fields: Record<string, unknown>;
    decided_at: Date | null;
    lapses_at: Date | null;
    document_id: number;
  }>(
    `SELECT cr.id, cr.type_code, ct.name AS type_name, ct.category, cr.technician_id, cr.fields, cr.decided_at, cr.lapses_at, cr.document_id
       FROM credentials cr JOIN credential_types ct ON ct.code = cr.type_code
      WHERE cr.state = 'verified' AND (cr.lapses_at IS NULL OR cr.lapses_at > $3)
        AND ((cr.company_id = $1 AND cr.technician_id IS NULL) OR cr.technician_id = $2)
      ORDER BY ct.category, ct.name, cr.id`,
    [t.company_id, t.id, asOf],
  );
  return rows.map((r) => ({
    id: r.id,
    typeCode: r.type_code,
    typeName: r.type_name,
    category: r.category,
    holder: r.technician_id === null ? "company" : "technician",
    fields: Object.fromEntries(Object.entries(r.fields).filter(([k]) => FIELDS_FOR_BUYERS.has(k))),
    decidedAt: r.decided_at ? new Date(r.decided_at).toISOString() : null,
    lapsesAt: r.lapses_at ? new Date(r.lapses_at).toISOString() : null,
    // Buyers may download verified certificates of insurance only (credentials/policy.ts canReadDocument).
    documentId: r.category === "insurance" ? r.document_id : null,
  }));
}

async function loadStandings(t: TechnicianRow, shopId: number, asOf: Date): Promise<ProfileStandingDto[]> {
  const rows = await select<{
    id: number;
    name: string;
    site_id: number | null;
    requirements: Requirement[];
    standing: Standing | null;
    earliest_lapse: Date | null;
    results: RequirementResult[] | null;
    computed_at: Date | null;
  }>(
    `SELECT rs.id, rs.name, rs.site_id, rs.requirements, s.standing, s.earliest_lapse, s.results, s.computed_at
       FROM requirement_sets rs
       LEFT JOIN technician_standings s ON s.requirement_set_id = rs.id AND s.technician_id = $2
      WHERE rs.company_id = $1 AND rs.active
      ORDER BY rs.name, rs.id`,
    [shopId, t.id],
  );
  const missing = rows.filter((r) => r.standing === null);
  const live = await computeStandingNow(
    { id: t.id, companyId: t.company_id, timeZone: t.time_zone },
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

/** Reviews from the work-order module's job_reviews table when it exists; read as JSON so a column added later is harmless. */
async function loadReviews(technicianId: number): Promise<ProfileReviewDto[]> {
  const [exists] = await select<{ present: boolean }>(
    "SELECT to_regclass('public.job_reviews') IS NOT NULL AS present",
    [],
  );
  if (!exists?.present) return [];
  const rows = await select<{ review: Record<string, unknown> }>(
    "SELECT to_jsonb(jr) AS review FROM job_reviews jr WHERE jr.technician_id = $1 ORDER BY jr.id DESC LIMIT 100",
    [technicianId],
  );
  return rows.map(({ review: j }) => ({
    id: Number(j.id),
    stars: Number(j.stars),
    text: textOf(j.text) ?? textOf(j.body) ?? textOf(j.comment),
    reply: textOf(j.reply) ?? textOf(j.reply_text) ?? textOf(j.reply_body),
    createdAt: textOf(j.created_at) ? new Date(String(j.created_at)).toISOString() : null,
  }));
}

async function loadEstimates(t: TechnicianRow, shopId: number, onSiteHours: number) {
  if (t.latitude === null || t.longitude === null) return [];
  const base = { lat: t.latitude, lon: t.longitude };
  const sites = await Site.findAll({
    where: { companyId: shopId, active: true },
    order: [
      ["name", "ASC"],
      ["id", "ASC"],
    ],
  });
  const rates = {
    hourlyRateCents: t.hourly_rate_cents,
    travelRateCents: t.travel_rate_cents,
    mileageRateCents: t.mileage_rate_cents,
  };
  return sites.map((site) => {
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
): Promise<DirectoryTechnicianDto> {
  const [t] = await select<TechnicianRow>(
    `SELECT t.id, t.name, t.company_id, c.name AS company_name, c.time_zone, t.technologies, t.control_families,
            t.service_radius_km, t.hourly_rate_cents, t.travel_rate_cents, t.mileage_rate_cents, t.latitude, t.longitude,
            b.standing, b.earliest_lapse, coalesce(r.review_count, 0)::int AS review_count, coalesce(r.star_sum, 0)::int AS star_sum
       FROM technicians t
       JOIN companies c ON c.id = t.company_id
       JOIN technician_standings b ON b.technician_id = t.id AND b.requirement_set_id IS NULL AND b.standing IN ('cleared','lapsing')
       LEFT JOIN technician_ratings r ON r.technician_id = t.id
      WHERE t.id = $1 AND t.active`,
    [technicianId],
  );
  if (!t) throw new AppError("not_found", "That technician was not found");
  const [credentials, requirementSets, reviews, estimates] = await Promise.all([
    loadCredentials(t, asOf),
    loadStandings(t, buyer.companyId, asOf),
    loadReviews(t.id),
    loadEstimates(t, buyer.companyId, onSiteHours),
  ]);
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
    credentials,
    requirementSets,
    rating: ratingSummary(t.review_count, t.star_sum),
    scoreSource: SCORE_SOURCE,
    reviews,
    estimates,
    assumptions: assumptions(onSiteHours),
    caution: CERTIFICATE_CAUTION,
  };
}
