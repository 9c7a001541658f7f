import { QueryTypes, type Transaction } from "sequelize";
import { greatCircleDistanceKm } from "../../../shared/geo/great-circle-distance.ts";
import { estimateTotal } from "../../../shared/service-requests/estimate-total.ts";
import { addCalendarDays } from "../../../shared/standing/iso-date.ts";
import { db } from "../sequelize.ts";

const HOUR = 3_600_000;

async function one<T extends object>(sql: string, bind: unknown[], transaction: Transaction): Promise<T> {
  const [row] = await db().query<T>(sql, { bind, transaction, type: QueryTypes.SELECT });
  if (!row) throw new Error(`demo service requests: nothing for ${sql.slice(0, 60)}`);
  return row;
}

interface Tech {
  id: number;
  company_id: number;
  latitude: number;
  longitude: number;
  hourly_rate_cents: number;
  travel_rate_cents: number;
  mileage_rate_cents: number;
}

/**
 * Open service requests for the Tamsin shop's Joliet plant, with answers in several states: a revised estimate, a
 * withdrawn one, a pass, and a machine-down request nobody has answered yet (the follow-up job's first reminder).
 * Written row by row like the API writes them, with totals from the shared computation.
 */
export async function insertDemoServiceRequests(today: Date, transaction: Transaction): Promise<void> {
  const shop = await one<{ id: number; buyer: number }>(
    `SELECT c.id, u.id AS buyer FROM companies c JOIN users u ON u.company_id = c.id AND u.role = 'buyer'
      WHERE c.name = 'Tamsin Gear & Shaft'`,
    [],
    transaction,
  );
  const site = { latitude: 41.525, longitude: -88.0817 };
  const siteId = (
    await one<{ id: number }>(
      `INSERT INTO sites (company_id, name, address_line, postal_code, time_zone, latitude, longitude)
       VALUES ($1, 'Tamsin Joliet plant', '610 Ropewalk Drive', '60432', 'America/Chicago', $2, $3) RETURNING id`,
      [shop.id, site.latitude, site.longitude],
      transaction,
    )
  ).id;
  const machineId = (
    await one<{ id: number }>(
      `INSERT INTO equipment (site_id, builder, control_family, technology, model, serial_number)
       VALUES ($1, 'Vantor Machine Works', 'Kestle 40', 'mill', 'VM-40 vertical mill', 'VM40-2209') RETURNING id`,
      [siteId],
      transaction,
    )
  ).id;
  const tech = (name: string) =>
    one<Tech>(
      `SELECT id, company_id, latitude, longitude, hourly_rate_cents, travel_rate_cents, mileage_rate_cents
         FROM technicians WHERE name = $1`,
      [name],
      transaction,
    );
  // In turn: the three reads share the transaction's one connection.
  const tobias = await tech("Tobias Wren");
  const henrik = await tech("Henrik Solberg-Paz");
  const saoirse = await tech("Saoirse Vandeleur");
  const day = today.toISOString().slice(0, 10);

  const request = async (state: string, problem: string, sentHoursAgo: number) =>
    (
      await one<{ id: number }>(
        `INSERT INTO service_requests (shop_company_id, site_id, equipment_id, kind, machine_state, timing, technology,
           builder, control_family, problem, created_by, sent_at)
         VALUES ($1, $2, $3, 'repair', $4, 'soonest', 'mill', 'Vantor Machine Works', 'Kestle 40', $5, $6, $7) RETURNING id`,
        [
          shop.id,
          siteId,
          machineId,
          state,
          problem,
          shop.buyer,
          new Date(today.getTime() - sentHoursAgo * HOUR),
        ],
        transaction,
      )
    ).id;
  const invite = (
    requestId: number,
    t: Tech,
    invitedHoursAgo: number,
    answer: "estimate" | "pass" | null,
    after = 1,
  ) =>
    db().query(
      `INSERT INTO service_request_invitations (request_id, company_id, source, invited_at, first_answer_at, answer, pass_reason)
       VALUES ($1, $2, 'routing', $3, $4, $5, $6)`,
      {
        bind: [
          requestId,
          t.company_id,
          new Date(today.getTime() - invitedHoursAgo * HOUR),
          answer ? new Date(today.getTime() - (invitedHoursAgo - after) * HOUR) : null,
          answer,
          answer === "pass" ? "Both mill technicians are booked this week" : null,
        ],
        transaction,
      },
    );
  const estimate = async (requestId: number, t: Tech, status: string, hoursList: number[]) => {
    const estimateId = (
      await one<{ id: number }>(
        "INSERT INTO service_request_estimates (request_id, company_id, status, revision) VALUES ($1, $2, $3, $4) RETURNING id",
        [requestId, t.company_id, status, hoursList.length],
        transaction,
      )
    ).id;
    const distanceKm = greatCircleDistanceKm(
      { lat: t.latitude, lon: t.longitude },
      { lat: site.latitude, lon: site.longitude },
    );
    for (const [i, onSiteHours] of hoursList.entries()) {
      const parts = [{ description: "Spindle drive fuse kit", quantity: 1, unitPriceCents: 4_200 }];
      const rates = {
        hourlyRateCents: t.hourly_rate_cents,
        travelRateCents: t.travel_rate_cents,
        mileageRateCents: t.mileage_rate_cents,
      };
      const total = estimateTotal({ distanceKm, onSiteHours, parts, ...rates });
      await db().query(
        `INSERT INTO service_request_estimate_revisions (estimate_id, revision, technician_id, hourly_rate_cents, travel_rate_cents,
           mileage_rate_cents, on_site_hours, earliest_arrival, parts, note, valid_until, distance_km, travel_cents, labour_cents,
           mileage_cents, parts_cents, total_cents, created_by)
         VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9::jsonb, $10, $11, $12, $13, $14, $15, $16, $17,
           (SELECT id FROM users WHERE company_id = $18 AND role = 'provider_admin' ORDER BY id LIMIT 1))`,
        {
          bind: [
            estimateId,
            i + 1,
            t.id,
            rates.hourlyRateCents,
            rates.travelRateCents,
            rates.mileageRateCents,
            onSiteHours,
            new Date(today.getTime() + 20 * HOUR),
            JSON.stringify(parts),
            i === 0 ? null : "More time on site after looking at the photos.",
            addCalendarDays(day, 10),
            distanceKm,
            total.travelCents,
            total.labourCents,
            total.mileageCents,
            total.partsCents,
            total.totalCents,
            t.company_id,
          ],
          transaction,
        },
      );
    }
  };
  const event = (requestId: number, kind: string, note: string) =>
    db().query(
      "INSERT INTO service_request_events (request_id, actor_user_id, kind, note) VALUES ($1, NULL, $2, $3)",
      {
        bind: [requestId, kind, note],
        transaction,
      },
    );

  const spindle = await request("running_fault", "Spindle alarm 2041 after each tool change", 20);
  await invite(spindle, tobias, 20, "estimate");
  await invite(spindle, henrik, 20, "estimate", 3);
  await invite(spindle, saoirse, 20, "pass", 2);
  await estimate(spindle, tobias, "active", [2, 3]);
  await estimate(spindle, henrik, "withdrawn", [2]);
  await event(spindle, "sent", "Sent to 3 companies");

  const down = await request("down", "won't power on", 0.5);
  await invite(down, tobias, 0.5, null);
  await invite(down, henrik, 0.5, null);
  await event(down, "sent", "Sent to 2 companies");
}
