import type { DirectoryFilterName } from "../../shared/directory/schemas.ts";
import { EARTH_MEAN_RADIUS_KM, unitChordForKm } from "../../shared/geo/great-circle-distance.ts";
import { spherePointSql, withinCubeSql } from "../db/sphere-sql.ts";
import { containsPattern, type SqlParams } from "./sql-params.ts";

/** A search with its references resolved (site location, machine) and its instant fixed. */
export interface DirectoryCriteria {
  asOf: Date;
  credentialTypes?: string[] | undefined;
  oem?:
    | {
        builder?: string | undefined;
        controlFamily?: string | undefined;
        minLevel?: number | undefined;
        /** Catalog keys (name and aliases) that stand for the builder / control family; replace the plain compare. */
        builderKeys?: string[] | undefined;
        controlFamilyKeys?: string[] | undefined;
      }
    | undefined;
  technology?: string | undefined;
  generalLiability?: { eachOccurrence?: number | undefined; aggregate?: number | undefined } | undefined;
  autoCombinedSingleLimit?: number | undefined;
  requirementSetId?: number | undefined;
  site?: { latitude: number; longitude: number; radiusKm: number } | undefined;
  minRating?: number | undefined;
  q?: string | undefined;
}

export interface FilterClause {
  name: DirectoryFilterName;
  sql: string;
}

// Base rows: active technicians whose stored baseline standing lists them. Aliases: t technician, c company,
// b baseline standing, r rating summary. `cleared_sets @> '{0}'` is the same fact kept on the technician's row (by a
// trigger on technician_standings), written literally so the planner can use technicians_listed_point_idx.
export const DIRECTORY_FROM = `FROM technicians t
  JOIN companies c ON c.id = t.company_id
  JOIN technician_standings b ON b.technician_id = t.id AND b.requirement_set_id IS NULL AND b.standing IN ('cleared','lapsing')
  LEFT JOIN technician_ratings r ON r.technician_id = t.id
  WHERE t.active AND t.cleared_sets @> '{0}'::integer[]`;

/**
 * A verified credential in force at asOf, held by the technician or, for company-held types (insurance), by the
 * technician's company. Two EXISTS rather than one OR so each uses its own index (credentials_technician_idx,
 * credentials_company_held_idx).
 */
function heldInForce(p: SqlParams, typeCode: string, asOf: Date, extra = ""): string {
  const type = p.add(typeCode);
  const now = p.add(asOf);
  const inForce = `cr.type_code = ${type} AND cr.state = 'verified' AND (cr.lapses_at IS NULL OR cr.lapses_at > ${now})${extra}`;
  // OFFSET 0 keeps each EXISTS a per-row index probe: in a nearest-first walk the planner cannot know how few rows it
  // will test, and would otherwise hash every company's insurance up front.
  return `(EXISTS (SELECT 1 FROM credentials cr WHERE cr.technician_id = t.id AND ${inForce} OFFSET 0)
    OR EXISTS (SELECT 1 FROM credentials cr WHERE cr.company_id = t.company_id AND cr.technician_id IS NULL AND ${inForce} OFFSET 0))`;
}

/** Haversine in SQL with the same mean Earth radius as shared/geo/great-circle-distance.ts. */
export function distanceSql(p: SqlParams, site: { latitude: number; longitude: number }): string {
  const lat = p.add(site.latitude);
  const lon = p.add(site.longitude);
  const radius = p.add(EARTH_MEAN_RADIUS_KM);
  return `(2 * ${radius}::float8 * asin(sqrt(least(1::float8,
    power(sin((radians(t.latitude) - radians(${lat}::float8)) / 2), 2)
    + cos(radians(${lat}::float8)) * cos(radians(t.latitude)) * power(sin(radians(t.longitude - ${lon}::float8) / 2), 2)))))`;
}

/** The site as a point on the unit sphere (see server/db/sphere-sql.ts). */
export function sitePointSql(p: SqlParams, site: { latitude: number; longitude: number }): string {
  return spherePointSql(p.add(site.latitude), p.add(site.longitude));
}

/**
 * Sort key of "nearest first": the chord to the site on the unit sphere. It grows with the great-circle distance
 * (chord = 2·sin(d / 2R)), so the order is the distance order, and it is the `<->` the GiST index returns in order.
 */
export function chordSql(p: SqlParams, site: { latitude: number; longitude: number }): string {
  return `(t.sphere_point <-> ${sitePointSql(p, site)})`;
}

/**
 * A cube around the site that holds every point of the sphere within `radiusKm` (its half-side is the chord of that
 * distance, plus a hair): the GiST index's prefilter before the exact haversine test.
 */
function radiusBoxSql(p: SqlParams, site: { latitude: number; longitude: number; radiusKm: number }): string {
  return withinCubeSql(sitePointSql(p, site), `${p.add(unitChordForKm(site.radiusKm) + 1e-9)}::float8`);
}

/** One SQL condition per filter the search uses, each named for the empty state. */
export function buildFilters(p: SqlParams, criteria: DirectoryCriteria): FilterClause[] {
  const filters: FilterClause[] = [];
  const { asOf } = criteria;
  if (criteria.credentialTypes?.length) {
    filters.push({
      name: "credentialTypes",
      sql: criteria.credentialTypes.map((code) => heldInForce(p, code, asOf)).join(" AND "),
    });
  }
  const oem = criteria.oem;
  if (oem && (oem.builder !== undefined || oem.controlFamily !== undefined || oem.minLevel !== undefined)) {
    // One training certificate must show the builder, the control family and the level together (names compared
    // without regard to case, as the standing engine does).
    let extra = "";
    const keyOf = (field: string) => `lower(regexp_replace(btrim(cr.fields->>'${field}'), '\\s+', ' ', 'g'))`;
    if (oem.builderKeys?.length) extra += ` AND ${keyOf("builder")} = ANY(${p.add(oem.builderKeys)}::text[])`;
    else if (oem.builder !== undefined)
      extra += ` AND lower(trim(cr.fields->>'builder')) = lower(${p.add(oem.builder)})`;
    if (oem.controlFamilyKeys?.length)
      extra += ` AND ${keyOf("controlFamily")} = ANY(${p.add(oem.controlFamilyKeys)}::text[])`;
    else if (oem.controlFamily !== undefined)
      extra += ` AND lower(trim(cr.fields->>'controlFamily')) = lower(${p.add(oem.controlFamily)})`;
    if (oem.minLevel !== undefined) extra += ` AND (cr.fields->>'level')::int >= ${p.add(oem.minLevel)}`;
    filters.push({ name: "oemTraining", sql: heldInForce(p, "oem_training", asOf, extra) });
  }
  if (criteria.technology !== undefined) {
    filters.push({
      name: "technology",
      sql: `t.technologies @> ARRAY[${p.add(criteria.technology)}::varchar]`,
    });
  }
  const gl = criteria.generalLiability;
  if (gl && (gl.eachOccurrence !== undefined || gl.aggregate !== undefined)) {
    let extra = "";
    if (gl.eachOccurrence !== undefined)
      extra += ` AND (cr.fields->'limits'->>'eachOccurrence')::bigint >= ${p.add(gl.eachOccurrence)}`;
    if (gl.aggregate !== undefined)
      extra += ` AND (cr.fields->'limits'->>'generalAggregate')::bigint >= ${p.add(gl.aggregate)}`;
    filters.push({ name: "generalLiability", sql: heldInForce(p, "general_liability", asOf, extra) });
  }
  if (criteria.autoCombinedSingleLimit !== undefined) {
    const extra = ` AND (cr.fields->'limits'->>'combinedSingleLimit')::bigint >= ${p.add(criteria.autoCombinedSingleLimit)}`;
    filters.push({ name: "autoLiability", sql: heldInForce(p, "auto_liability", asOf, extra) });
  }
  if (criteria.requirementSetId !== undefined) {
    filters.push({
      name: "requirementSetId",
      // The stored fact on the technician's row: the set's standing lists them (cleared or lapsing).
      sql: `t.cleared_sets @> ARRAY[${p.add(criteria.requirementSetId)}::integer]`,
    });
  }
  if (criteria.site) {
    // Inside the technician's own service radius AND the buyer's search radius.
    filters.push({
      name: "distance",
      sql: `${radiusBoxSql(p, criteria.site)}
        AND ${distanceSql(p, criteria.site)} <= least(t.service_radius_km::float8, ${p.add(criteria.site.radiusKm)}::float8)`,
    });
  }
  if (criteria.minRating !== undefined) {
    filters.push({
      name: "minRating",
      sql: `(r.review_count > 0 AND r.star_sum::float8 / r.review_count >= ${p.add(criteria.minRating)}::float8)`,
    });
  }
  if (criteria.q !== undefined) {
    const pattern = p.add(containsPattern(criteria.q));
    filters.push({ name: "q", sql: `(t.name ILIKE ${pattern} OR c.name ILIKE ${pattern})` });
  }
  return filters;
}
