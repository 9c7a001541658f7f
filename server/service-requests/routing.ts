import type { Transaction } from "sequelize";
import { DEFAULT_RADIUS_MILES } from "../../shared/directory/schemas.ts";
import { milesToKm } from "../../shared/geo/units.ts";
import { EARTH_MEAN_RADIUS_KM, kmToMiles, unitChordForKm } from "../../shared/geo/great-circle-distance.ts";
import { spherePointSql, withinCubeSql } from "../db/sphere-sql.ts";
import type { RoutedCompanyDto } from "../../shared/service-requests/schemas.ts";
import { select } from "./sql.ts";

/** What routing needs of a request: where, on what machine, against which requirement set, at which instant. */
export interface RoutingCriteria {
  asOf: Date;
  site: { latitude: number; longitude: number };
  technology: string;
  requirementSetId: number | null;
  builder?: string | null | undefined;
  controlFamily?: string | null | undefined;
  /** The shop's reach, like the directory's search radius: the site must be inside both radii. */
  radiusKm?: number | undefined;
}

/**
 * A technician cleared at `asOf` for the set: the stored standing lists them (baseline, and the set when one applies)
 * and its earliest lapse is still ahead, so a standing stored before a lapse that has since happened does not count.
 * `$1` is the instant, `$2` the set (0 = baseline only). Inactive (hidden) technicians never count.
 */
const CLEARED = `t.active AND c.kind = 'service'
  AND EXISTS (SELECT 1 FROM technician_standings b WHERE b.technician_id = t.id AND b.requirement_set_id IS NULL
    AND b.standing IN ('cleared','lapsing') AND (b.earliest_lapse IS NULL OR b.earliest_lapse > $1))
  AND ($2::int = 0 OR EXISTS (SELECT 1 FROM technician_standings s WHERE s.technician_id = t.id
    AND s.requirement_set_id = $2 AND s.standing IN ('cleared','lapsing') AND (s.earliest_lapse IS NULL OR s.earliest_lapse > $1)))`;

const DISTANCE = `(2 * $5::float8 * asin(sqrt(least(1::float8,
    power(sin((radians(t.latitude) - radians($3::float8)) / 2), 2)
    + cos(radians($3::float8)) * cos(radians(t.latitude)) * power(sin(radians(t.longitude - $4::float8) / 2), 2)))))`;

// OEM-trained: a verified builder training in force whose builder or control family is the one the request names.
const OEM = `EXISTS (SELECT 1 FROM credentials cr WHERE cr.technician_id = t.id AND cr.type_code = 'oem_training'
    AND cr.state = 'verified' AND (cr.lapses_at IS NULL OR cr.lapses_at > $1)
    AND ((coalesce($7::text, '') <> '' AND lower(trim(cr.fields->>'builder')) = lower($7::text))
      OR (coalesce($8::text, '') <> '' AND lower(trim(cr.fields->>'controlFamily')) = lower($8::text))))`;

interface CompanyRow {
  company_id: number;
  company_name: string;
  cleared: number;
  oem: boolean;
  nearest_km: number | null;
}

const toDto = (r: CompanyRow, source: RoutedCompanyDto["source"]): RoutedCompanyDto => ({
  companyId: r.company_id,
  companyName: r.company_name,
  clearedTechnicians: Number(r.cleared),
  oemTrained: r.oem,
  nearestMiles: r.nearest_km === null ? null : Number(kmToMiles(Number(r.nearest_km)).toFixed(1)),
  source,
});

/**
 * The companies a request goes to: at least one technician cleared now for the set, who serves the machine's
 * technology (and lists its control family when the request names one), and whose service radius reaches the site
 * (inside the shop's reach too). OEM-trained companies rank first, then the nearest.
 */
export async function routeRequest(
  criteria: RoutingCriteria,
  transaction?: Transaction,
): Promise<RoutedCompanyDto[]> {
  const reachKm = criteria.radiusKm ?? milesToKm(DEFAULT_RADIUS_MILES);
  const rows = await select<CompanyRow>(
    `SELECT t.company_id, c.name AS company_name, count(*)::int AS cleared,
            bool_or(${OEM}) AS oem, min(${DISTANCE}) AS nearest_km
       FROM technicians t JOIN companies c ON c.id = t.company_id
      WHERE ${CLEARED}
        AND t.latitude IS NOT NULL AND t.longitude IS NOT NULL
        AND t.technologies @> ARRAY[$6::varchar]
        AND (coalesce($8::text, '') = '' OR EXISTS (SELECT 1 FROM unnest(t.control_families) cf WHERE lower(cf) = lower($8::text)))
        AND ${DISTANCE} <= least(t.service_radius_km::float8, $9::float8)
        -- Implied by the two lines above (the stored standing lists the baseline; the site is inside the shop's
        -- reach), and they let the GiST index of listed technicians drop the far ones before the exact test.
        AND t.cleared_sets @> '{0}'::integer[]
        AND ${withinCubeSql(spherePointSql("$3", "$4"), "$10::float8")}
      GROUP BY t.company_id, c.name
      ORDER BY bool_or(${OEM}) DESC, min(${DISTANCE}), c.name, t.company_id`,
    [
      criteria.asOf,
      criteria.requirementSetId ?? 0,
      criteria.site.latitude,
      criteria.site.longitude,
      EARTH_MEAN_RADIUS_KM,
      criteria.technology,
      criteria.builder ?? null,
      criteria.controlFamily ?? null,
      reachKm,
      unitChordForKm(reachKm) + 1e-9,
    ],
    transaction,
  );
  return rows.map((r) => toDto(r, "routing"));
}

/** Of the given companies, those with at least one technician cleared now for the set (whatever the distance). */
export async function companiesWithClearedTechnician(
  companyIds: readonly number[],
  asOf: Date,
  requirementSetId: number | null,
  transaction?: Transaction,
): Promise<RoutedCompanyDto[]> {
  if (companyIds.length === 0) return [];
  const rows = await select<CompanyRow>(
    `SELECT t.company_id, c.name AS company_name, count(*)::int AS cleared, false AS oem, NULL::float8 AS nearest_km
       FROM technicians t JOIN companies c ON c.id = t.company_id
      WHERE ${CLEARED} AND t.company_id = ANY($3::int[])
      GROUP BY t.company_id, c.name ORDER BY c.name, t.company_id`,
    [asOf, requirementSetId ?? 0, [...companyIds]],
    transaction,
  );
  return rows.map((r) => toDto(r, "buyer"));
}

/** Service companies on the shop's roster, listed as a company or through one of its technicians. */
export async function rosterCompanyIds(
  shopCompanyId: number,
  transaction?: Transaction,
): Promise<Set<number>> {
  const rows = await select<{ company_id: number }>(
    `SELECT coalesce(r.service_company_id, t.company_id) AS company_id
       FROM roster_entries r LEFT JOIN technicians t ON t.id = r.technician_id
      WHERE r.shop_company_id = $1`,
    [shopCompanyId],
    transaction,
  );
  return new Set(rows.map((r) => r.company_id));
}
