import { calendarDateIn, formatCalendarDate } from "../../shared/dates/local-time.ts";
import { maintenanceWindow, planDue } from "../../shared/machines/maintenance-due.ts";
import type {
  MaintenanceRequestInput,
  RaisedMaintenanceRequestDto,
} from "../../shared/machines/maintenance-schemas.ts";
import { AppError } from "../http/app-error.ts";
import { raiseServiceRequest } from "../service-requests/index.ts";
import { findMachine, planFacts, readingsOf, select, type PlanRow } from "./maintenance-plans.ts";

export function intervalWords(row: Pick<PlanRow, "interval_kind" | "interval_months" | "interval_hours">) {
  if (row.interval_kind === "hours")
    return `every ${row.interval_hours!.toLocaleString("en-US")} running hours`;
  return row.interval_months === 1 ? "every month" : `every ${row.interval_months} months`;
}

function lastDoneWords(row: PlanRow) {
  if (row.interval_kind === "hours") return `last done at ${row.last_done_hours!.toLocaleString("en-US")} h`;
  return `last done ${formatCalendarDate(row.last_done_on!)}`;
}

/**
 * One click from the plan: a preventive-maintenance request for that machine, planned (the machine runs), with the
 * window leading up to the due date, linked to the plan so the confirmed work moves the plan on.
 */
export async function requestPlannedService(
  user: Express.User,
  machineId: number,
  planId: number,
  input: MaintenanceRequestInput,
  linkBase: string,
): Promise<RaisedMaintenanceRequestDto> {
  const machine = await findMachine(machineId);
  if (!machine || machine.company_id !== user.companyId)
    throw new AppError("not_found", "That machine was not found");
  const [plan] = await select<PlanRow>(
    `SELECT id, equipment_id, name, interval_kind, interval_months, interval_hours, last_done_on::text,
            last_done_hours, updated_at
       FROM maintenance_plans WHERE id = $1 AND equipment_id = $2`,
    [planId, machineId],
  );
  if (!plan) throw new AppError("not_found", "That maintenance plan was not found");
  const today = calendarDateIn(new Date(), machine.time_zone);
  const due = planDue(planFacts(plan), await readingsOf(machineId), today);
  const window = maintenanceWindow(due.dueOn, today);
  const windowStart = input.windowStart ?? window.windowStart;
  const windowEnd =
    input.windowEnd ??
    (input.windowStart && input.windowStart > window.windowEnd ? input.windowStart : window.windowEnd);
  if (windowEnd < windowStart)
    throw new AppError("invalid_input", "The window ends before it starts", [
      { path: "body.windowEnd", message: "must not be before the start" },
    ]);
  const dueWords = due.dueOn
    ? `${due.estimated ? "projected due" : "due"} ${formatCalendarDate(due.dueOn)}`
    : `due at ${due.dueHours!.toLocaleString("en-US")} h`;
  // The request's kind is shown beside it on every screen and heads the work order's problem: the text starts with
  // the plan, or the work order read "Preventive maintenance (service request #3): Preventive maintenance: ...".
  const problem = [
    `${plan.name} (${intervalWords(plan)}; ${lastDoneWords(plan)}; ${dueWords}).`,
    `Machine: ${machine.builder} ${machine.model}${machine.serial_number ? `, serial ${machine.serial_number}` : ""}.`,
    ...(input.note ? [input.note] : []),
  ].join("\n");
  const raised = await raiseServiceRequest(
    user,
    {
      siteId: machine.site_id,
      equipmentId: machineId,
      requirementSetId: input.requirementSetId ?? null,
      kind: "preventive_maintenance",
      machineState: "planned",
      timing: "window",
      windowStart,
      windowEnd,
      problem,
      addCompanyIds: [],
      removeCompanyIds: [],
    },
    linkBase,
    async (requestId, transaction) => {
      // The plan row is locked first, so of two clicks at once the second sees the first's request and stops.
      await select("SELECT id FROM maintenance_plans WHERE id = $1 FOR UPDATE", [planId], transaction);
      const [open] = await select<{ service_request_id: number }>(
        `SELECT mpr.service_request_id FROM maintenance_plan_requests mpr
           JOIN service_requests sr ON sr.id = mpr.service_request_id
          WHERE mpr.plan_id = $1 AND mpr.due_key = $2 AND mpr.done_work_order_id IS NULL
            AND sr.status IN ('open', 'decided')`,
        [planId, due.dueKey],
        transaction,
      );
      if (open)
        throw new AppError(
          "conflict",
          `Service request #${open.service_request_id} is already open for this plan; cancel it before raising another`,
        );
      await select(
        `INSERT INTO maintenance_plan_requests (plan_id, service_request_id, due_key, window_start, window_end, created_by)
         VALUES ($1, $2, $3, $4, $5, $6) RETURNING id`,
        [planId, requestId, due.dueKey, windowStart, windowEnd, user.id],
        transaction,
      );
    },
  );
  return { serviceRequestId: raised.id, windowStart, windowEnd };
}
