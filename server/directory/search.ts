import { listCatalog } from "../machines/catalog-service.ts";
import { matchKeysFor } from "../../shared/machines/catalog.ts";
import { QueryTypes } from "sequelize";
import {
  DEFAULT_RADIUS_MILES,
  type DirectoryFilterName,
  type DirectoryQuery,
  type DirectorySort,
} from "../../shared/directory/schemas.ts";
import type { DirectoryPageDto, DirectoryRowDto } from "../../shared/directory/directory-shapes.ts";
import { milesToKm } from "../../shared/geo/units.ts";
import { DEFAULT_PRIOR } from "../../shared/ranking/rating-score.ts";
import { db } from "../db/sequelize.ts";
import { preparedRows } from "../db/sql.ts";
import { withinCubeSql } from "../db/sphere-sql.ts";
import { AppError } from "../http/app-error.ts";
import { findShopEquipment } from "../sites/index.ts";
import { decodeCursor, encodeCursor } from "./cursor.ts";
import { assumptions, estimateTrip, ratingSummary, SCORE_SOURCE } from "./estimates.ts";
import {
  buildFilters,
  chordSql,
  DIRECTORY_FROM,
  distanceSql,
  sitePointSql,
  type DirectoryCriteria,
} from "./search-filters.ts";
import { SqlParams } from "./sql-params.ts";
import { storedScoreIsCurrent } from "./stored-score.ts";
import type { JudgedAgainstDto } from "../../shared/directory/directory-shapes.ts";
import { loadRequirementsMet } from "./requirements-met.ts";

interface DirectoryRow {
  id: number;
  name: string;
  company_id: number;
  company_name: string;
  technologies: string[];
  control_families: string[];
  service_radius_km: number;
  hourly_rate_cents: number;
  travel_rate_cents: number;
  mileage_rate_cents: number;
  standing: "cleared" | "lapsing";
  earliest_lapse: Date | null;
  review_count: number;
  star_sum: number;
  distance_km: number | null;
  sort_key: number;
  on_roster: "technician" | "company" | null;
}

// "Never lapses" sorts after every real lapse instant (seconds since 1970; year 33658).
const NEVER_LAPSES_EPOCH = 1e12;

async function ownRequirementSet(companyId: number, id: number): Promise<string> {
  const rows = await preparedRows<{ id: number; name: string }>(
    "SELECT id, name FROM requirement_sets WHERE id = $1 AND company_id = $2",
    [id, companyId],
  );
  const row = rows[0];
  if (!row) throw new AppError("not_found", "That requirement set was not found");
  return row.name;
}

/**
 * The shop's site and the set the shop attached to it (the lowest id when several were), in one statement; null when
 * the site is missing or another company's.
 */
async function siteWithRequirementSet(companyId: number, siteId: number) {
  const rows = await preparedRows<{
    latitude: number;
    longitude: number;
    set_id: number | null;
    set_name: string | null;
  }>(
    `SELECT s.latitude, s.longitude, rs.id AS set_id, rs.name AS set_name
       FROM sites s
       LEFT JOIN LATERAL (SELECT id, name FROM requirement_sets
                           WHERE site_id = s.id AND company_id = $2 AND active ORDER BY id LIMIT 1) rs ON true
      WHERE s.id = $1 AND s.company_id = $2`,
    [siteId, companyId],
  );
  return rows[0] ?? null;
}

/** Resolves the shop's own site, set and machine (a foreign one answers 404 like a missing one). */
async function resolveCriteria(buyer: Express.User, query: DirectoryQuery, asOf: Date) {
  const criteria: DirectoryCriteria = {
    asOf,
    credentialTypes: query.credentialTypes,
    technology: query.technology,
    generalLiability: { eachOccurrence: query.minEachOccurrence, aggregate: query.minAggregate },
    autoCombinedSingleLimit: query.minAutoCsl,
    requirementSetId: query.requirementSetId,
    minRating: query.minRating,
    q: query.q,
  };
  let controlFamily = query.controlFamily;
  let fromEquipment: DirectoryPageDto["fromEquipment"] = null;
  let fromEquipmentBuilder: string | undefined;
  if (query.equipmentId !== undefined) {
    const machine = await findShopEquipment(buyer.companyId, query.equipmentId);
    if (!machine) throw new AppError("not_found", "That machine was not found");
    fromEquipment = {
      technology: machine.technology,
      controlFamily: machine.controlFamily,
      builder: machine.builder,
    };
    criteria.technology ??= machine.technology;
    controlFamily ??= machine.controlFamily;
    fromEquipmentBuilder = machine.builder;
  }
  let builder = query.oemBuilder;
  if (fromEquipment) builder ??= fromEquipmentBuilder;
  // One read of the catalog for both names.
  const catalog = builder !== undefined || controlFamily !== undefined ? await listCatalog() : [];
  const keysOf = (kind: "builder" | "control_family", typed: string | undefined) =>
    typed === undefined
      ? undefined
      : matchKeysFor(
          catalog.filter((e) => e.kind === kind),
          typed,
        );
  criteria.oem = {
    builder,
    controlFamily,
    minLevel: query.minOemLevel,
    builderKeys: keysOf("builder", builder),
    controlFamilyKeys: keysOf("control_family", controlFamily),
  };
  let judgedAgainst: JudgedAgainstDto = { kind: "baseline" };
  if (query.requirementSetId !== undefined) {
    const name = await ownRequirementSet(buyer.companyId, query.requirementSetId);
    judgedAgainst = {
      kind: "requirement_set",
      requirementSetId: query.requirementSetId,
      name,
      fromSite: false,
    };
  }
  if (query.siteId !== undefined) {
    const site = await siteWithRequirementSet(buyer.companyId, query.siteId);
    if (!site) throw new AppError("not_found", "That site was not found");
    criteria.site = {
      latitude: site.latitude,
      longitude: site.longitude,
      radiusKm: milesToKm(query.radiusMiles ?? DEFAULT_RADIUS_MILES),
    };
    // The buyer decides for a site: its own rules apply unless another set was asked for.
    if (query.requirementSetId === undefined && site.set_id !== null) {
      criteria.requirementSetId = site.set_id;
      judgedAgainst = {
        kind: "requirement_set",
        requirementSetId: site.set_id,
        name: site.set_name ?? "",
        fromSite: true,
      };
    }
  }
  return { criteria, fromEquipment, judgedAgainst };
}

function sortKeySql(sort: DirectorySort, chord: string | null, p: SqlParams, ratedOnly: boolean): string {
  switch (sort) {
    case "distance":
      return chord ?? "0";
    case "score": {
      // Highest score first: the key is the negated Bayesian average, so every sort pages ascending on (key, id).
      // With a minimum rating every row has a ratings row, so the key is the stored score itself, which
      // technician_ratings_score_idx returns in order (the same float8 value as the expression below).
      if (ratedOnly && storedScoreIsCurrent) return "-r.ranking_score";
      const weight = p.add(DEFAULT_PRIOR.weight);
      const mean = p.add(DEFAULT_PRIOR.mean);
      return `-((${weight}::float8 * ${mean}::float8 + coalesce(r.star_sum, 0)) / (${weight}::float8 + coalesce(r.review_count, 0)))`;
    }
    case "hourlyRate":
      return "t.hourly_rate_cents::float8";
    case "soonestLapse":
      return `coalesce(extract(epoch FROM b.earliest_lapse)::float8, ${NEVER_LAPSES_EPOCH}::float8)`;
  }
}

/**
 * Nearest first without sorting the whole radius. PostgreSQL 15 walks a GiST index in distance order (KNN) only for
 * an ORDER BY of the distance alone, while the page is keyset-ordered by (distance, id). So the walk takes the first
 * `limit` matching rows nearest first (technicians_listed_point_idx, inside the radius box), and adds any other
 * matching row at exactly the distance of the last one (a tie the walk may have cut, e.g. two technicians at one ZIP
 * centroid); the page is those rows sorted by (distance, id), the same page a full sort would give. The filters are
 * tested once, in the walk; the page query only joins what it shows.
 */
function nearestFirst(
  p: SqlParams,
  where: string,
  site: { latitude: number; longitude: number },
  cursor: { key: number; id: number } | null,
  limit: string,
): { with: string; where: string } {
  const chord = chordSql(p, site);
  const after = cursor
    ? ` AND (${chord}, t.id) > (${p.add(cursor.key)}::float8, ${p.add(cursor.id)}::int)`
    : "";
  const margin = p.add(1e-9);
  return {
    with: `WITH walk AS MATERIALIZED (SELECT t.id, ${chord} AS key ${DIRECTORY_FROM}${where}${after} ORDER BY 2 LIMIT ${limit}),
     nearest_ids AS (SELECT id FROM walk UNION SELECT t.id ${DIRECTORY_FROM}${where}${after}
        AND ${withinCubeSql(sitePointSql(p, site), `(SELECT max(key) FROM walk) + ${margin}::float8`)}
        AND ${chord} = (SELECT max(key) FROM walk))
     `,
    where: " AND t.id IN (SELECT id FROM nearest_ids)",
  };
}

function toRowDto(
  row: DirectoryRow,
  onSiteHours: number,
  requirementsMet: DirectoryRowDto["requirementsMet"],
): DirectoryRowDto {
  const rates = {
    hourlyRateCents: row.hourly_rate_cents,
    travelRateCents: row.travel_rate_cents,
    mileageRateCents: row.mileage_rate_cents,
  };
  const trip = row.distance_km === null ? null : estimateTrip(Number(row.distance_km), rates, onSiteHours);
  return {
    technicianId: row.id,
    name: row.name,
    companyId: row.company_id,
    companyName: row.company_name,
    technologies: row.technologies,
    controlFamilies: row.control_families,
    serviceRadiusKm: row.service_radius_km,
    distanceKm: trip?.distanceKm ?? null,
    distanceMiles: trip?.distanceMiles ?? null,
    roadMiles: trip?.roadMiles ?? null,
    driveHours: trip?.driveHours ?? null,
    callOut: trip?.callOut ?? null,
    rating: ratingSummary(row.review_count, row.star_sum),
    standing: row.standing,
    earliestLapse: row.earliest_lapse ? new Date(row.earliest_lapse).toISOString() : null,
    requirementsMet,
    onRoster: row.on_roster,
    ...rates,
  };
}

/**
 * With an empty first page: counts, in one scan, the candidates left when each filter in turn is dropped; the filter
 * whose removal brings back the most is the one to loosen. One statement whatever the number of filters.
 */
async function findEmptyReason(criteria: DirectoryCriteria): Promise<DirectoryPageDto["emptyReason"]> {
  const p = new SqlParams();
  const filters = buildFilters(p, criteria);
  if (filters.length === 0) return null;
  const columns = filters.map((_f, i) => {
    const others = filters.filter((_g, j) => j !== i).map((g) => `(${g.sql})`);
    return `count(*) FILTER (WHERE ${others.length ? others.join(" AND ") : "true"})::int AS f${i}`;
  });
  // Every filter once more in a column of its own, so each bound parameter is referenced even with a single filter.
  columns.push(`count(*) FILTER (WHERE ${filters.map((f) => `(${f.sql})`).join(" AND ")})::int AS matching`);
  const [counts] = await db().query<Record<string, number>>(
    `SELECT ${columns.join(", ")} ${DIRECTORY_FROM}`,
    {
      bind: p.values,
      type: QueryTypes.SELECT,
    },
  );
  let best: { filter: DirectoryFilterName; removed: number } | null = null;
  filters.forEach((f, i) => {
    const removed = counts?.[`f${i}`] ?? 0;
    if (best === null || removed > best.removed) best = { filter: f.name, removed };
  });
  // No filter to blame when loosening any one of them still lists nobody (e.g. every nearby technician lapsed).
  const blamed = best as { filter: DirectoryFilterName; removed: number } | null;
  return blamed && blamed.removed > 0 ? blamed : null;
}

/** The directory: one keyset-paged SQL query over listable technicians, estimates computed by the shared code. */
export async function searchDirectory(
  buyer: Express.User,
  query: DirectoryQuery,
  asOf = new Date(),
): Promise<DirectoryPageDto> {
  const { criteria, fromEquipment, judgedAgainst } = await resolveCriteria(buyer, query, asOf);
  const sort: DirectorySort = query.sort ?? (criteria.site ? "distance" : "score");
  if (sort === "distance" && !criteria.site) {
    throw new AppError("bad_request", "Sorting by distance needs a site", [
      { path: "query.sort", message: "choose a site first" },
    ]);
  }
  const cursor = query.cursor ? decodeCursor(query.cursor, sort) : null;

  const p = new SqlParams();
  const distance = criteria.site ? distanceSql(p, criteria.site) : null;
  const chord = sort === "distance" && criteria.site ? chordSql(p, criteria.site) : null;
  const sortKey = sortKeySql(sort, chord, p, criteria.minRating !== undefined);
  const filters = buildFilters(p, criteria);
  const where = filters.map((f) => ` AND (${f.sql})`).join("");
  const after = cursor
    ? `WHERE (x.sort_key, x.id) > (${p.add(cursor.key)}::float8, ${p.add(cursor.id)}::int)`
    : "";
  // Under a requirement set the badge shows that set's standing, never the baseline's (which may be wider).
  const setParam = criteria.requirementSetId === undefined ? null : p.add(criteria.requirementSetId);
  const setStanding = (col: string) =>
    `(SELECT ss.${col} FROM technician_standings ss WHERE ss.technician_id = t.id AND ss.requirement_set_id = ${setParam}) AS ${col}`;
  const standingCols =
    setParam === null
      ? "b.standing, b.earliest_lapse"
      : `${setStanding("standing")}, ${setStanding("earliest_lapse")}`;
  const shopParam = p.add(buyer.companyId);
  // A company entry covers all its technicians; the technician's own entry is named first when both exist.
  const onRoster = `(SELECT CASE WHEN bool_or(re.technician_id = t.id) THEN 'technician' ELSE 'company' END
       FROM roster_entries re WHERE re.shop_company_id = ${shopParam}
        AND (re.technician_id = t.id OR re.service_company_id = t.company_id)
     HAVING count(*) > 0) AS on_roster`;
  const limit = p.add(query.limit + 1);
  const nearest =
    sort === "distance" && criteria.site ? nearestFirst(p, where, criteria.site, cursor, limit) : null;
  // Prepared like the other hot statements; a new combination of filters past the per-connection cap runs unnamed.
  const rows = await preparedRows<DirectoryRow>(
    `${nearest?.with ?? ""}SELECT x.* FROM (
       SELECT t.id, t.name, t.company_id, c.name AS company_name, t.technologies, t.control_families, t.service_radius_km,
              t.hourly_rate_cents, t.travel_rate_cents, t.mileage_rate_cents, ${standingCols},
              coalesce(r.review_count, 0)::int AS review_count, coalesce(r.star_sum, 0)::int AS star_sum,
              ${distance ?? "NULL::float8"} AS distance_km, ${sortKey} AS sort_key, ${onRoster}
       ${DIRECTORY_FROM}${nearest?.where ?? where}
     ) x ${after}
     ORDER BY x.sort_key, x.id
     LIMIT ${limit}`,
    p.values,
  );

  const page = rows.slice(0, query.limit);
  const last = page[page.length - 1];
  const nextCursor =
    rows.length > query.limit && last
      ? encodeCursor({ sort, key: Number(last.sort_key), id: last.id })
      : null;
  const emptyReason = page.length === 0 && !cursor ? await findEmptyReason(criteria) : null;
  const setId = criteria.requirementSetId;
  const met =
    setId === undefined
      ? null
      : await loadRequirementsMet(
          setId,
          page.map((r) => r.id),
        );
  return {
    rows: page.map((r) => toRowDto(r, query.onSiteHours, met ? (met.get(r.id) ?? []) : null)),
    nextCursor,
    sort,
    emptyReason,
    fromEquipment,
    scoreSource: SCORE_SOURCE,
    assumptions: assumptions(query.onSiteHours),
    judgedAgainst,
  };
}
