import type { FollowUpRowDto } from "../../shared/service-requests/schemas.ts";
import { addBusinessHours, reminderThresholdHours } from "../../shared/service-requests/business-hours.ts";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { siteArea } from "./raise-request.ts";
import { tellCompany, tellShop } from "./notify.ts";
import { listInvitations, requestLink, type RequestRow } from "./records.ts";
import { run, select } from "./sql.ts";

export interface FollowUpSettings {
  normalHours: number;
  downHours: number;
  expiryHours: number;
  linkBase: string;
}

export interface FollowUpReport {
  reminded: number;
  companiesReminded: number;
  expired: number;
}

type OpenRow = RequestRow & { time_zone: string; estimates: number };

/**
 * Reminds the companies that have not answered once a request has gone its threshold of business hours (at the site)
 * without an estimate, and expires requests left undecided too long. Each reminder is claimed by inserting its event
 * under a unique key, so two instances running at once remind once; each expiry by a conditional update.
 */
export async function followUpServiceRequests(
  asOf: Date,
  settings: FollowUpSettings,
): Promise<FollowUpReport> {
  const report: FollowUpReport = { reminded: 0, companiesReminded: 0, expired: 0 };
  const open = await select<OpenRow>(
    `SELECT r.*, s.time_zone,
            (SELECT count(*)::int FROM service_request_estimates e WHERE e.request_id = r.id AND e.status = 'active') AS estimates
       FROM service_requests r JOIN sites s ON s.id = r.site_id
      WHERE r.status = 'open' AND r.sent_at <= $1 ORDER BY r.id`,
    [asOf],
  );
  for (const request of open) {
    const sentAt = new Date(request.sent_at);
    if (asOf.getTime() >= sentAt.getTime() + settings.expiryHours * 3_600_000) {
      if (await expire(request, settings.linkBase)) report.expired += 1;
      continue;
    }
    if (request.estimates > 0) continue;
    const threshold = reminderThresholdHours(request.machine_state, {
      normalHours: settings.normalHours,
      downHours: settings.downHours,
    });
    if (asOf < addBusinessHours(sentAt, threshold, request.time_zone)) continue;
    const told = await remind(request, threshold, settings.linkBase);
    if (told !== null) {
      report.reminded += 1;
      report.companiesReminded += told;
    }
  }
  return report;
}

/** Null when another run already sent this reminder. */
async function remind(request: OpenRow, threshold: number, linkBase: string): Promise<number | null> {
  return db().transaction(async (transaction) => {
    const claimed = await select<{ id: number }>(
      `INSERT INTO service_request_events (request_id, kind, threshold_hours, note)
       VALUES ($1, 'reminder_sent', $2, $3)
       ON CONFLICT (request_id, threshold_hours) WHERE kind = 'reminder_sent' DO NOTHING RETURNING id`,
      [request.id, threshold, `No estimate after ${threshold} business hours; invited companies reminded`],
      transaction,
    );
    if (claimed.length === 0) return null;
    const unanswered = (await listInvitations(request.id, transaction)).filter((i) => i.answer === null);
    const area = siteArea(
      (
        await select<{ postal_code: string }>(
          "SELECT postal_code FROM sites WHERE id = $1",
          [request.site_id],
          transaction,
        )
      )[0]!.postal_code,
    );
    for (const invitation of unanswered) {
      await tellCompany(
        invitation.company_id,
        {
          kind: "service_request.reminder",
          title: `Reminder: service request #${request.id} near ${area.city}, ${area.state} has no estimate yet`,
          lines: [
            request.machine_state === "down"
              ? "The shop's machine is down and no company has answered yet."
              : "No company has answered this request yet.",
            "Send an estimate, or pass so the shop knows to look elsewhere.",
          ],
          link: requestLink(linkBase, request.id, "service"),
        },
        transaction,
      );
    }
    return unanswered.length;
  });
}

async function expire(request: OpenRow, linkBase: string): Promise<boolean> {
  return db().transaction(async (transaction) => {
    const rows = await select<{ id: number }>(
      "UPDATE service_requests SET status = 'expired', decided_at = $2, updated_at = now() WHERE id = $1 AND status = 'open' RETURNING id",
      [request.id, new Date()],
      transaction,
    );
    if (rows.length === 0) return false;
    await run(
      "UPDATE service_request_estimates SET status = 'not_chosen', updated_at = now() WHERE request_id = $1 AND status = 'active'",
      [request.id],
      transaction,
    );
    await run(
      "INSERT INTO service_request_events (request_id, kind, note) VALUES ($1, 'expired', 'Expired without a decision')",
      [request.id],
      transaction,
    );
    for (const invitation of await listInvitations(request.id, transaction)) {
      await tellCompany(
        invitation.company_id,
        {
          kind: "service_request.expired",
          title: `Service request #${request.id} expired`,
          lines: [
            "The shop did not decide on this request in time, so it has expired. Thank you for looking.",
          ],
          link: requestLink(linkBase, request.id, "service"),
        },
        transaction,
      );
    }
    await tellShop(
      request,
      {
        kind: "service_request.expired",
        title: `Service request #${request.id} expired`,
        lines: [
          "Your service request expired without a decision. Raise it again if the work is still needed.",
        ],
        link: requestLink(linkBase, request.id, "shop"),
      },
      transaction,
    );
    return true;
  });
}

/** Open requests that needed a reminder and still have no estimate: what the coordinators chase. */
export async function listFollowUps(): Promise<FollowUpRowDto[]> {
  const rows = await select<{
    id: number;
    shop_name: string;
    machine_state: FollowUpRowDto["machineState"];
    postal_code: string;
    sent_at: Date;
    invited: number;
    answered: number;
    reminders: number;
    last_action: string | null;
  }>(
    `SELECT r.id, c.name AS shop_name, r.machine_state, s.postal_code, r.sent_at,
            (SELECT count(*)::int FROM service_request_invitations i WHERE i.request_id = r.id) AS invited,
            (SELECT count(*)::int FROM service_request_invitations i WHERE i.request_id = r.id AND i.answer IS NOT NULL) AS answered,
            (SELECT count(*)::int FROM service_request_events e WHERE e.request_id = r.id AND e.kind = 'reminder_sent') AS reminders,
            (SELECT e.note FROM service_request_events e WHERE e.request_id = r.id AND e.kind = 'follow_up' ORDER BY e.id DESC LIMIT 1) AS last_action
       FROM service_requests r JOIN companies c ON c.id = r.shop_company_id JOIN sites s ON s.id = r.site_id
      WHERE r.status = 'open'
        AND EXISTS (SELECT 1 FROM service_request_events e WHERE e.request_id = r.id AND e.kind = 'reminder_sent')
        AND NOT EXISTS (SELECT 1 FROM service_request_estimates e WHERE e.request_id = r.id AND e.status = 'active')
      ORDER BY (r.machine_state = 'down') DESC, r.sent_at`,
    [],
  );
  return rows.map((r) => {
    const area = siteArea(r.postal_code);
    return {
      requestId: r.id,
      shopName: r.shop_name,
      machineState: r.machine_state,
      siteArea: `${area.city}, ${area.state} ${area.postalCode}`,
      sentAt: new Date(r.sent_at).toISOString(),
      invited: r.invited,
      answered: r.answered,
      remindersSent: r.reminders,
      lastAction: r.last_action,
    };
  });
}

/** A coordinator's note on the request's timeline ("called the company", "widened the search"). */
export async function logFollowUp(admin: Express.User, requestId: number, note: string) {
  return db().transaction(async (transaction) => {
    const found = await select<{ id: number }>(
      "SELECT id FROM service_requests WHERE id = $1",
      [requestId],
      transaction,
    );
    if (found.length === 0) throw new AppError("not_found", "That service request was not found");
    await run(
      "INSERT INTO service_request_events (request_id, actor_user_id, kind, note) VALUES ($1, $2, 'follow_up', $3)",
      [requestId, admin.id, note],
      transaction,
    );
    await recordAudit(
      {
        actorUserId: admin.id,
        action: "service_request.follow_up",
        subjectType: "service_request",
        subjectId: requestId,
        after: { note },
      },
      transaction,
    );
    return { requestId, logged: true as const };
  });
}
