import { createHash, randomBytes } from "node:crypto";
import ical, { ICalCalendarMethod } from "ical-generator";
import { QueryTypes } from "sequelize";
import { db } from "../db/sequelize.ts";

interface LapseRow {
  credential_id: number;
  type_name: string;
  technician_id: number | null;
  holder_name: string;
  lapses_at: Date;
}

const digest = (secret: string) => createHash("sha256").update(secret).digest("hex");
const DAY = 86_400_000;

/** A new secret for the company's feed; the old address stops working at once. Only its digest is stored. */
export async function rotateCalendarFeed(user: Express.User): Promise<{ secret: string }> {
  const secret = randomBytes(24).toString("base64url");
  await db().query(
    `INSERT INTO calendar_feeds (company_id, secret_sha256, created_by) VALUES ($1, $2, $3)
     ON CONFLICT (company_id) DO UPDATE SET secret_sha256 = EXCLUDED.secret_sha256, created_by = EXCLUDED.created_by,
       created_at = CURRENT_TIMESTAMP`,
    { bind: [user.companyId, digest(secret), user.id] },
  );
  return { secret };
}

export async function calendarFeedStatus(
  user: Express.User,
): Promise<{ active: boolean; createdAt: string | null }> {
  const [row] = await db().query<{ created_at: Date }>(
    "SELECT created_at FROM calendar_feeds WHERE company_id = $1",
    { bind: [user.companyId], type: QueryTypes.SELECT },
  );
  return { active: !!row, createdAt: row ? new Date(row.created_at).toISOString() : null };
}

export async function stopCalendarFeed(user: Express.User): Promise<{ active: false }> {
  await db().query("DELETE FROM calendar_feeds WHERE company_id = $1", { bind: [user.companyId] });
  return { active: false };
}

/** Verified credentials still in force: the company's own (service side) or its roster's (shop side). */
async function comingLapses(companyId: number, kind: string, now: Date): Promise<LapseRow[]> {
  const holders =
    kind === "shop"
      ? `(c.technician_id IN (SELECT technician_id FROM roster_entries WHERE shop_company_id = $1 AND technician_id IS NOT NULL)
          OR c.company_id IN (SELECT service_company_id FROM roster_entries WHERE shop_company_id = $1 AND service_company_id IS NOT NULL)
          OR (c.technician_id IS NULL AND c.company_id IN (SELECT t.company_id FROM roster_entries re
                JOIN technicians t ON t.id = re.technician_id WHERE re.shop_company_id = $1)))`
      : "c.company_id = $1";
  return db().query<LapseRow>(
    `SELECT c.id AS credential_id, ct.name AS type_name, c.technician_id,
            coalesce(t.name, co.name) AS holder_name, c.lapses_at
       FROM credentials c JOIN credential_types ct ON ct.code = c.type_code
       JOIN companies co ON co.id = c.company_id LEFT JOIN technicians t ON t.id = c.technician_id
      WHERE c.state = 'verified' AND c.lapses_at IS NOT NULL AND c.lapses_at > $2 AND ${holders}
      ORDER BY c.lapses_at, c.id`,
    { bind: [companyId, now], type: QueryTypes.SELECT },
  );
}

/**
 * The iCalendar text for the feed with this secret, or null for an unknown or rotated secret. One all-day event on
 * each lapse date and one on each warning date still ahead; UIDs are stable so a calendar updates rather than doubles.
 */
export async function calendarFor(
  secret: string,
  options: { warningDays: readonly number[]; publicUrl: string; now?: Date },
): Promise<string | null> {
  const [feed] = await db().query<{ company_id: number; kind: string; name: string; time_zone: string }>(
    `SELECT f.company_id, co.kind, co.name, co.time_zone FROM calendar_feeds f JOIN companies co ON co.id = f.company_id
      WHERE f.secret_sha256 = $1`,
    { bind: [digest(secret)], type: QueryTypes.SELECT },
  );
  if (!feed) return null;
  const now = options.now ?? new Date();
  const calendar = ical({
    name: `Clearbench lapses: ${feed.name}`,
    prodId: { company: "Clearbench", product: "lapse-calendar", language: "EN" },
    method: ICalCalendarMethod.PUBLISH,
  });
  for (const row of await comingLapses(feed.company_id, feed.kind, now)) {
    const lapse = new Date(row.lapses_at);
    const link = new URL(linkPath(feed.kind, row), options.publicUrl).toString();
    const about = `${row.type_name} held by ${row.holder_name}`;
    calendar.createEvent({
      id: `lapse-${row.credential_id}-${lapse.getTime()}@clearbench`,
      start: localDate(lapse, feed.time_zone),
      allDay: true,
      summary: `Lapses: ${row.type_name}, ${row.holder_name}`,
      description: `${about} stops counting on this date.\n${link}`,
      url: link,
      stamp: now,
    });
    for (const days of options.warningDays) {
      const warnAt = new Date(lapse.getTime() - days * DAY);
      if (warnAt <= now) continue;
      calendar.createEvent({
        id: `warn-${row.credential_id}-${lapse.getTime()}-${days}@clearbench`,
        start: localDate(warnAt, feed.time_zone),
        allDay: true,
        summary: `${days} day${days === 1 ? "" : "s"} to lapse: ${row.type_name}, ${row.holder_name}`,
        description: `${about} lapses in ${days} day${days === 1 ? "" : "s"}.\n${link}`,
        url: link,
        stamp: now,
      });
    }
  }
  return calendar.toString();
}

function linkPath(kind: string, row: LapseRow): string {
  if (kind === "shop") return row.technician_id ? `/directory/technicians/${row.technician_id}` : "/roster";
  return row.technician_id ? `/provider/technicians/${row.technician_id}` : "/provider/documents";
}

/** The calendar date of an instant in the reader's zone, as a floating date for an all-day event (RFC 5545 §3.3.4). */
function localDate(instant: Date, timeZone: string): Date {
  const parts = new Intl.DateTimeFormat("en-CA", {
    timeZone,
    year: "numeric",
    month: "2-digit",
    day: "2-digit",
  })
    .format(instant)
    .split("-")
    .map(Number) as [number, number, number];
  return new Date(Date.UTC(parts[0], parts[1] - 1, parts[2]));
}
