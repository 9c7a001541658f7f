import type { Transaction } from "sequelize";
import { calendarDateIn, formatCalendarDate } from "../../shared/dates/local-time.ts";
import {
  planDue,
  reminderThresholdFor,
  type HourReading,
  type PlanDue,
} from "../../shared/machines/maintenance-due.ts";
import { LOCKOUT_CAUTION } from "../../shared/safety/cautions.ts";
import { composeMail } from "../mail/index.ts";
import { runStatement, selectRows } from "../db/sql.ts";
import { planFacts, type PlanRow } from "./maintenance-plans.ts";
import { intervalWords } from "./maintenance-requests.ts";

interface CandidateRow extends PlanRow {
  company_id: number;
  time_zone: string;
  site_name: string;
  builder: string;
  model: string;
  serial_number: string | null;
  readings: HourReading[] | null;
  open_due_keys: string[];
}

interface Owed {
  plan: CandidateRow;
  due: PlanDue;
  threshold: number;
}

// Calendar plans more than a month and a day away cannot owe a 30-day reminder in any zone; the rest are checked here.
const PREFILTER_DAYS = 32;

/** Every plan that may owe a reminder, with what the due rule needs; one statement whatever the number of plans. */
function candidates(transaction: Transaction, asOf: Date) {
  return selectRows<CandidateRow>(
    transaction,
    `SELECT p.id, p.equipment_id, p.name, p.interval_kind, p.interval_months, p.interval_hours, p.last_done_on::text,
            p.last_done_hours, p.updated_at, s.company_id, s.time_zone, s.name AS site_name, e.builder, e.model,
            e.serial_number,
            CASE WHEN p.interval_kind = 'hours' THEN (
              SELECT coalesce(json_agg(json_build_object('readOn', r.read_on::text, 'hours', r.hours) ORDER BY r.read_on, r.id), '[]')
                FROM machine_hour_readings r
               WHERE r.equipment_id = p.equipment_id
                 AND r.read_on >= (SELECT max(read_on) - 366 FROM machine_hour_readings WHERE equipment_id = p.equipment_id))
            END AS readings,
            ARRAY(SELECT mpr.due_key FROM maintenance_plan_requests mpr
                    JOIN service_requests sr ON sr.id = mpr.service_request_id
                   WHERE mpr.plan_id = p.id AND mpr.done_work_order_id IS NULL AND sr.status IN ('open', 'decided'))
              AS open_due_keys
       FROM maintenance_plans p
       JOIN equipment e ON e.id = p.equipment_id
       JOIN sites s ON s.id = e.site_id AND s.active
      WHERE p.interval_kind = 'hours'
         OR p.last_done_on + make_interval(months => p.interval_months) <= ($1::timestamptz AT TIME ZONE 'UTC')::date + ${PREFILTER_DAYS}
      ORDER BY p.id`,
    [asOf.toISOString()],
  );
}

/** What each plan owes today at its site; a plan whose request is already raised for this due date owes nothing. */
function owedReminders(rows: CandidateRow[], asOf: Date): Owed[] {
  const owed: Owed[] = [];
  for (const plan of rows) {
    const due = planDue(planFacts(plan), plan.readings ?? [], calendarDateIn(asOf, plan.time_zone));
    const threshold = reminderThresholdFor(due.daysUntil);
    if (threshold !== null && !plan.open_due_keys.includes(due.dueKey)) owed.push({ plan, due, threshold });
  }
  return owed;
}

function whenWords(due: PlanDue) {
  const days = due.daysUntil!;
  const on = due.dueOn ? ` (${due.estimated ? "projected for " : ""}${formatCalendarDate(due.dueOn)})` : "";
  if (days < 0) return `${-days} ${days === -1 ? "day" : "days"} overdue${on}`;
  if (days === 0) return `due now${on}`;
  return `due in ${days} ${days === 1 ? "day" : "days"}${on}`;
}

function reminderContent(owed: Owed, base: string) {
  const { plan, due } = owed;
  const machine = `${plan.builder} ${plan.model}${plan.serial_number ? ` (serial ${plan.serial_number})` : ""}`;
  const when = whenWords(due);
  const hours =
    due.dueHours !== null
      ? [
          `It falls due at ${due.dueHours.toLocaleString("en-US")} running hours; the meter last read ${due.currentHours!.toLocaleString("en-US")} h.`,
        ]
      : [];
  return {
    // Notification titles and subjects hold 300 characters; a long plan and model name is cut, never refused.
    title: `Maintenance ${when}: ${plan.name} on ${plan.builder} ${plan.model}`.slice(0, 300),
    body: [
      `${plan.name}, ${intervalWords(plan)}, on the ${machine} at ${plan.site_name} is ${when}.`,
      ...hours,
    ],
    link: `/machines/${plan.equipment_id}/maintenance?plan=${plan.id}`,
    url: `${base}/machines/${plan.equipment_id}/maintenance?plan=${plan.id}`,
  };
}

/**
 * The daily job's maintenance step: reminds each shop's buyers 30 and 7 days before a plan falls due, once per plan,
 * due occurrence, threshold and owning shop (kept by a unique constraint, so reruns and a second job process add
 * nothing, while a machine's buyer still hears of a due date its seller was told of), with a bell notification and an
 * e-mail in HTML and text. A fixed number of statements whatever the number of plans.
 */
export async function remindMaintenanceDue(
  transaction: Transaction,
  { asOf, jobRunId, publicUrl }: { asOf: Date; jobRunId: number; publicUrl: string },
): Promise<{ maintenanceReminders: number; maintenanceEmails: number }> {
  const owed = owedReminders(await candidates(transaction, asOf), asOf);
  const kept = await selectRows<{ plan_id: number; due_key: string; threshold_days: number }>(
    transaction,
    `INSERT INTO maintenance_reminders (plan_id, due_key, threshold_days, due_on, job_run_id, shop_company_id)
     SELECT x.plan_id, x.due_key, x.threshold_days, x.due_on::date, $2, x.shop_company_id
       FROM jsonb_to_recordset($1::jsonb) AS x(plan_id int, due_key text, threshold_days int, due_on text, shop_company_id int)
     ON CONFLICT ON CONSTRAINT maintenance_reminders_once DO NOTHING
     RETURNING plan_id, due_key, threshold_days`,
    [
      JSON.stringify(
        owed.map((o) => ({
          plan_id: o.plan.id,
          due_key: o.due.dueKey,
          threshold_days: o.threshold,
          due_on: o.due.dueOn,
          shop_company_id: o.plan.company_id,
        })),
      ),
      jobRunId,
    ],
  );
  const fresh = owed.filter((o) => kept.some((k) => k.plan_id === o.plan.id && k.due_key === o.due.dueKey));
  const buyers = await selectRows<{ id: number; email: string; name: string; company_id: number }>(
    transaction,
    "SELECT id, email, name, company_id FROM users WHERE company_id = ANY($1::int[]) AND role = 'buyer' AND active ORDER BY id",
    [[...new Set(fresh.map((o) => o.plan.company_id))]],
  );
  const notifications: object[] = [];
  const mails: object[] = [];
  for (const o of fresh) {
    const content = reminderContent(o, publicUrl);
    for (const buyer of buyers.filter((b) => b.company_id === o.plan.company_id)) {
      notifications.push({
        user_id: buyer.id,
        title: content.title,
        body: content.body.join("\n"),
        link: content.link,
      });
      const mail = composeMail({
        to: buyer.email,
        subject: content.title,
        greetName: buyer.name,
        paragraphs: content.body,
        next: {
          sentence:
            "Raise the preventive-maintenance request from the plan: the machine and the window are filled in.",
          label: "Open the maintenance plans",
          url: content.url,
        },
        after: [LOCKOUT_CAUTION],
      });
      mails.push({ to_address: mail.to, subject: mail.subject, text_body: mail.text, html_body: mail.html });
    }
  }
  await runStatement(
    transaction,
    `INSERT INTO notifications (user_id, kind, title, body, link)
     SELECT x.user_id, 'maintenance.due', x.title, x.body, x.link
       FROM jsonb_to_recordset($1::jsonb) AS x(user_id int, title text, body text, link text)`,
    [JSON.stringify(notifications)],
  );
  await runStatement(
    transaction,
    `INSERT INTO outbox_messages (to_address, subject, text_body, html_body)
     SELECT x.to_address, x.subject, x.text_body, x.html_body
       FROM jsonb_to_recordset($1::jsonb) AS x(to_address text, subject text, text_body text, html_body text)`,
    [JSON.stringify(mails)],
  );
  return { maintenanceReminders: kept.length, maintenanceEmails: mails.length };
}
