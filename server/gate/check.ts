import { db } from "../db/sequelize.ts";
import { preparedRows } from "../db/sql.ts";
import { computeStandings } from "../standing/compute-stored-standings.ts";
import { loadStandingInputs, loadTargets } from "../standing/standing-inputs.ts";
import type { StandingResult } from "../../shared/standing/standing-types.ts";
import type { GateCheckDto } from "../../shared/gate/check-answer.ts";
import { jpegDataUrl } from "./photo.ts";
import { checkBadgeToken, siteFromGateCode } from "./token.ts";

interface GateRow {
  technician_id: number;
  technician_name: string;
  company_id: number;
  company_name: string;
  site_id: number | null;
  site_name: string | null;
  shop_company_id: number | null;
  set_id: number | null;
  set_name: string | null;
  standing: string | null;
  results: StandingResult["results"] | null;
  work_order: { id: number; technology: string } | null;
  jpeg: Buffer | null;
}

/** Standings the front desk shows as cleared (lapsing is cleared until its lapse instant). */
const CLEARED_AT_GATE = ["cleared", "lapsing"];

/**
 * Everything the gate shows, in one statement: the technician and company, the site with its active set, the stored
 * standing against that set (or the baseline when the site has none), the accepted order with the site's today among
 * its dates, and the photo. "Today" is the site's calendar date, so a check at 7 a.m. in Chicago is not matched against
 * the date already begun in UTC. When the standing is stored, the same statement records the check ($4: the standings
 * shown as cleared); `logged` says it did, and only a standing not stored yet leaves the INSERT to checkAtGate.
 */
const GATE_SQL = `
  WITH site AS (
    SELECT s.id, s.name, s.company_id, s.time_zone, rs.id AS set_id, rs.name AS set_name
      FROM sites s
      LEFT JOIN LATERAL (SELECT id, name FROM requirement_sets
                          WHERE site_id = s.id AND active ORDER BY id LIMIT 1) rs ON true
     WHERE s.id = $2::int),
  found AS (
  SELECT t.id AS technician_id, t.name AS technician_name, t.company_id, c.name AS company_name,
         site.id AS site_id, site.name AS site_name, site.company_id AS shop_company_id,
         site.set_id, site.set_name, st.standing, st.results,
         (SELECT jsonb_build_object('id', w.id, 'technology', w.technology) FROM work_orders w
           WHERE w.technician_id = t.id AND w.site_id = site.id AND w.shop_company_id = site.company_id
             AND w.status = 'accepted'
             AND w.preferred_dates @> jsonb_build_array(to_char($3::timestamptz AT TIME ZONE site.time_zone, 'YYYY-MM-DD'))
           ORDER BY w.accepted_at DESC, w.id DESC LIMIT 1) AS work_order,
         (SELECT p.jpeg FROM technician_photos p WHERE p.technician_id = t.id) AS jpeg
    FROM technicians t
    JOIN companies c ON c.id = t.company_id
    LEFT JOIN site ON true
    LEFT JOIN technician_standings st
      ON st.technician_id = t.id AND coalesce(st.requirement_set_id, 0) = coalesce(site.set_id, 0)
   WHERE t.id = $1::int),
  logged AS (
    INSERT INTO gate_checks (technician_id, service_company_id, site_id, shop_company_id, state, checked_at)
    SELECT technician_id, company_id, site_id, shop_company_id,
           CASE WHEN standing = ANY($4::text[]) THEN 'cleared' ELSE 'not_cleared' END, $3::timestamptz
      FROM found WHERE standing IS NOT NULL
    RETURNING technician_id)
  SELECT found.*, EXISTS (SELECT 1 FROM logged) AS logged FROM found`;

/**
 * What the front desk sees for a scanned badge: who, for which company, and whether cleared at this instant against the
 * site's requirement set (or the platform baseline). Nothing else about the technician, the company or other shops.
 * One statement reads and records the check; a standing not stored yet is computed for that one target only, then
 * recorded by an INSERT of its own.
 */
export async function checkAtGate(
  secret: string,
  token: string,
  siteCode: string | undefined,
): Promise<GateCheckDto> {
  const now = new Date();
  const checkedAt = now.toISOString();
  const verdict = checkBadgeToken(secret, token, now);
  if (verdict.state !== "valid") return { state: verdict.state, checkedAt };
  const siteId = siteCode ? siteFromGateCode(secret, siteCode) : null;
  const [row] = await preparedRows<GateRow & { logged: boolean }>(GATE_SQL, [
    verdict.technicianId,
    siteId,
    now,
    CLEARED_AT_GATE,
  ]);
  if (!row) return { state: "invalid", checkedAt };
  const chosen = row.standing
    ? { standing: row.standing, results: row.results ?? [] }
    : await computeOneStanding(row.technician_id, row.set_id, now);
  const state = chosen && CLEARED_AT_GATE.includes(chosen.standing) ? "cleared" : "not_cleared";
  if (!row.logged)
    await db().query(
      `INSERT INTO gate_checks (technician_id, service_company_id, site_id, shop_company_id, state, checked_at)
       VALUES ($1, $2, $3, $4, $5, $6)`,
      { bind: [row.technician_id, row.company_id, row.site_id, row.shop_company_id, state, now] },
    );
  const photo = row.jpeg ? jpegDataUrl(row.jpeg) : null;
  return {
    state,
    checkedAt,
    technician: { name: row.technician_name, company: row.company_name, ...(photo ? { photo } : {}) },
    site: row.site_id !== null ? { name: row.site_name ?? "" } : null,
    against: row.set_name ?? "Platform baseline",
    lines: (chosen?.results ?? []).map((r) => ({ requirement: r.requirement.label, status: r.status })),
    workOrder: row.work_order,
  };
}

/** A technician or set newer than the last refresh has no stored row yet: the engine answers for that one target. */
async function computeOneStanding(technicianId: number, setId: number | null, now: Date) {
  return db().transaction(async (transaction) => {
    const targets = (await loadTargets(transaction, setId === null ? undefined : [setId])).filter(
      (t) => t.id === setId,
    );
    const inputs = await loadStandingInputs({ companyIds: [], technicianIds: [technicianId] }, transaction, {
      targets,
    });
    const [computed] = computeStandings(inputs, now);
    return computed ? { standing: computed.standing, results: computed.results } : null;
  });
}
