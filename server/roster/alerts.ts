import { QueryTypes } from "sequelize";
import { ROSTER_LAPSE_ALERT_DAYS, type RosterAlertEvent } from "../../shared/roster/schemas.ts";
import type { RequirementResult, Standing } from "../../shared/standing/standing-types.ts";
import { MS_PER_DAY } from "../../shared/standing/warning-windows.ts";
import { formatLocalDateTime } from "../../shared/dates/local-time.ts";
import { isListed } from "../../shared/visibility/technician-visibility.ts";
import { loadConfig, publicUrl } from "../config.ts";
import { db } from "../db/sequelize.ts";
import { composeMail } from "../mail/index.ts";
import { tellPerson } from "../notices/index.ts";
import { onStandingsChanged, type ChangedStanding } from "../standing/index.ts";

interface RosteredRow {
  shop_company_id: number;
  technician_id: number;
  active: boolean;
  /** The shop rostered this technician by name (not only through their company). */
  direct: boolean;
  name: string;
  company_name: string;
  standing: Standing;
  earliest_lapse: Date | null;
  results: RequirementResult[];
  computed_at: Date;
  /** The shop's zone: buyers read dates on their own clock. */
  shop_time_zone: string;
}

let linkBase: string | undefined;

/** The absolute base of links in alert e-mails (PUBLIC_URL), set by the app and the job runner from their config. */
export function setRosterAlertLinkBase(base: string): void {
  linkBase = base.replace(/\/$/, "");
}

const rosterUrl = () => `${linkBase ?? publicUrl(loadConfig()).replace(/\/$/, "")}/roster`;

interface Alert {
  shopId: number;
  technicianId: number;
  event: RosterAlertEvent;
  /** Tells this occurrence from the next one (the lapse instant, or what is unmet), so it is sent once. */
  key: string;
  title: string;
  body: string;
  next: string;
}

function unmetSignature(results: RequirementResult[]): string {
  const unmet = results
    .filter((r) => r.status === "unmet")
    .map((r) => `${r.requirement.id ?? r.requirement.label}:${r.reason ?? ""}:${r.lapsesAt ?? ""}`)
    .sort();
  return (unmet.join("|") || "not_cleared").slice(0, 300);
}

/**
 * What, if anything, a shop must hear about a rostered technician. The reference instant is the standing's own
 * computed_at (the job's "as of"), so a demo run with a future date judges "within 30 days" at that date.
 */
function alertFor(row: RosteredRow, wasListed: ReadonlySet<number>): Alert | null {
  const who = `${row.name} (${row.company_name})`;
  // The shared rule hides unlisted technicians from shops: a shop that rostered only the company hears about one only
  // as they leave the directory, never about a technician it could not have seen.
  if (
    !row.direct &&
    !(wasListed.has(row.technician_id) || isListed({ active: row.active, baseline: row.standing }))
  )
    return null;
  if (row.standing === "not_cleared") {
    const reasons = row.results.filter((r) => r.status === "unmet").map((r) => r.detail);
    return {
      shopId: row.shop_company_id,
      technicianId: row.technician_id,
      event: "stopped_clearing",
      key: unmetSignature(row.results),
      title: `${who} is no longer cleared`,
      body: `${who}, on your roster, is no longer cleared: they are hidden from the directory and cannot take new work orders. ${reasons.join(" ")}`.trim(),
      next: "Choose another cleared technician for open work, or ask the service company when the missing document will be verified.",
    };
  }
  if (row.earliest_lapse === null) return null;
  const lapse = new Date(row.earliest_lapse);
  const remaining = lapse.getTime() - new Date(row.computed_at).getTime();
  if (remaining <= 0 || remaining > ROSTER_LAPSE_ALERT_DAYS * MS_PER_DAY) return null;
  const days = Math.ceil(remaining / MS_PER_DAY);
  // The person does not lapse; the credential does. Name it when the stored results say which one it is.
  const lapsing = row.results.find(
    (r) => r.lapsesAt !== null && new Date(r.lapsesAt).getTime() === lapse.getTime(),
  );
  const what = lapsing ? lapsing.requirement.label : "A credential";
  return {
    shopId: row.shop_company_id,
    technicianId: row.technician_id,
    event: "lapse_within_30_days",
    key: lapse.toISOString(),
    title: `${what} for ${who} lapses in ${days} day${days === 1 ? "" : "s"}`,
    body: `${what}, which ${who} needs to stay cleared, lapses on ${formatLocalDateTime(lapse, row.shop_time_zone)} (in ${days} day${days === 1 ? "" : "s"}) unless a renewal is verified.`,
    next: "Nothing is needed from you yet; if you have work booked after that date, ask the service company whether the renewal is on its way.",
  };
}

/** One alert per shop, technician and event: the unique key decides, so a repeated call sends nothing twice. */
async function deliverAlert(alert: Alert): Promise<boolean> {
  return db().transaction(async (transaction) => {
    const inserted = await db().query<{ id: number }>(
      `INSERT INTO roster_alerts (shop_company_id, technician_id, event, event_key) VALUES ($1, $2, $3, $4)
       ON CONFLICT DO NOTHING RETURNING id`,
      {
        bind: [alert.shopId, alert.technicianId, alert.event, alert.key],
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    if (inserted.length === 0) return false;
    const buyers = await db().query<{ id: number; email: string }>(
      "SELECT id, email FROM users WHERE company_id = $1 AND role = 'buyer' AND active ORDER BY id",
      { bind: [alert.shopId], type: QueryTypes.SELECT, transaction },
    );
    for (const buyer of buyers) {
      await tellPerson(
        composeMail({
          to: buyer.email,
          subject: alert.title.slice(0, 300),
          paragraphs: [alert.body],
          next: { sentence: alert.next, label: "See your roster", url: rosterUrl() },
        }),
        { kind: `roster_${alert.event}`, link: "/roster" },
        transaction,
      );
    }
    return true;
  });
}

/** Alerts the shops that roster any of these technicians, directly or through their company. Returns alerts sent. */
export async function alertRosteredShops(
  technicianIds: readonly number[],
  wasListed: ReadonlySet<number> = new Set(),
): Promise<number> {
  if (technicianIds.length === 0) return 0;
  const rows = await db().query<RosteredRow>(
    `SELECT DISTINCT ON (re.shop_company_id, t.id) re.shop_company_id, t.id AS technician_id, t.active, t.name,
            c.name AS company_name, b.standing, b.earliest_lapse, b.results, b.computed_at, sc.time_zone AS shop_time_zone,
            EXISTS (SELECT 1 FROM roster_entries d WHERE d.shop_company_id = re.shop_company_id AND d.technician_id = t.id) AS direct
       FROM technicians t
       JOIN companies c ON c.id = t.company_id
       JOIN roster_entries re ON re.technician_id = t.id OR re.service_company_id = t.company_id
       JOIN companies sc ON sc.id = re.shop_company_id
       JOIN technician_standings b ON b.technician_id = t.id AND b.requirement_set_id IS NULL
      WHERE t.id = ANY($1::int[])
      ORDER BY re.shop_company_id, t.id`,
    { bind: [[...new Set(technicianIds)]], type: QueryTypes.SELECT },
  );
  let sent = 0;
  for (const row of rows) {
    const alert = alertFor(row, wasListed);
    if (alert && (await deliverAlert(alert))) sent += 1;
  }
  return sent;
}

/** For the daily job: every rostered technician, so "within 30 days" is caught even when the standing did not change. */
export async function sweepRosterAlerts(): Promise<number> {
  const rows = await db().query<{ id: number }>(
    `SELECT DISTINCT t.id FROM technicians t
       JOIN roster_entries re ON re.technician_id = t.id OR re.service_company_id = t.company_id`,
    { type: QueryTypes.SELECT },
  );
  return alertRosteredShops(rows.map((r) => r.id));
}

/** The standing hook's listener: only baseline changes move a technician in or out of the directory. */
export function alertOnBaselineChanges(changes: readonly ChangedStanding[]): Promise<number> {
  const baseline = changes.filter((c) => c.requirementSetId === null);
  const wasListed = new Set(
    baseline.filter((c) => c.before === "cleared" || c.before === "lapsing").map((c) => c.technicianId),
  );
  return alertRosteredShops(
    baseline.map((c) => c.technicianId),
    wasListed,
  );
}

let unsubscribe: (() => void) | undefined;

/** Subscribes once per process, whoever calls it first (the app, or a job runner). */
export function registerRosterAlerts(): void {
  unsubscribe ??= onStandingsChanged(async (changes) => {
    await alertOnBaselineChanges(changes);
  });
}
