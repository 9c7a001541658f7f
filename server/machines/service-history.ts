import { QueryTypes } from "sequelize";
import {
  findRepeatFaults,
  type HistoryAttachmentDto,
  type HistoryEntryDto,
  type MachineHistoryDto,
  type PartUsed,
  type ProblemArea,
  type WorkKind,
} from "../../shared/machines/service-history.ts";
import { calendarDateIn } from "../../shared/dates/local-time.ts";
import { snapshotForBuyer } from "../../shared/visibility/technician-visibility.ts";
import type { StandingSnapshot } from "../../shared/work-orders/standing-snapshot.ts";
import { db } from "../db/sequelize.ts";
import { historyAccess } from "../../shared/machines/ownership-periods.ts";
import { ownershipPeriods } from "./ownership.ts";

interface WorkOrderRow {
  id: number;
  completed_at: Date | null;
  confirmed_at: Date;
  work_kind: WorkKind | null;
  problem_area: ProblemArea | null;
  problem: string;
  hours_worked: string | null;
  travel_hours: string | null;
  completion_note: string | null;
  parts_used: PartUsed[] | null;
  snapshot_completed: StandingSnapshot | null;
  service_company_name: string;
  technician_name: string;
  time_zone: string;
}

interface ShopRecordRow {
  id: number;
  performed_on: string;
  work_kind: WorkKind;
  problem_area: ProblemArea | null;
  service_company_name: string | null;
  technician_name: string | null;
  hours_on_site: string | null;
  travel_hours: string | null;
  note: string;
  parts_used: PartUsed[] | null;
}

interface AttachmentRow {
  message_id: number;
  work_order_id: number;
  document_id: number;
  original_name: string;
  mime: string;
  size_bytes: number;
}

const hours = (v: string | null) => (v === null ? null : Number(v));

// Only a confirmed work order is history: the shop has agreed the work was done.
async function confirmedWorkOrders(machineId: number) {
  return db().query<WorkOrderRow>(
    `SELECT wo.id, wo.completed_at, wo.confirmed_at, wo.work_kind, wo.problem_area, wo.problem, wo.hours_worked,
            wo.travel_hours, wo.completion_note, wo.parts_used, wo.snapshot_completed,
            svc.name AS service_company_name, t.name AS technician_name, s.time_zone
       FROM work_orders wo
       JOIN companies svc ON svc.id = wo.service_company_id
       JOIN technicians t ON t.id = wo.technician_id
       JOIN sites s ON s.id = wo.site_id
      WHERE wo.equipment_id = $1 AND wo.status = 'confirmed'`,
    { bind: [machineId], type: QueryTypes.SELECT },
  );
}

async function attachmentsOf(workOrderIds: number[]): Promise<Map<number, HistoryAttachmentDto[]>> {
  const byWorkOrder = new Map<number, HistoryAttachmentDto[]>();
  if (workOrderIds.length === 0) return byWorkOrder;
  const rows = await db().query<AttachmentRow>(
    `SELECT m.id AS message_id, m.work_order_id, d.id AS document_id, d.original_name, d.mime, d.size_bytes
       FROM work_order_messages m JOIN documents d ON d.id = m.document_id
      WHERE m.work_order_id = ANY($1::int[]) ORDER BY m.id`,
    { bind: [workOrderIds], type: QueryTypes.SELECT },
  );
  for (const r of rows) {
    const list = byWorkOrder.get(r.work_order_id) ?? [];
    list.push({
      documentId: r.document_id,
      name: r.original_name,
      mime: r.mime,
      sizeBytes: Number(r.size_bytes),
      url: `/api/work-orders/${r.work_order_id}/messages/${r.message_id}/file`,
    });
    byWorkOrder.set(r.work_order_id, list);
  }
  return byWorkOrder;
}

async function shopRecords(machineId: number) {
  return db().query<ShopRecordRow>(
    `SELECT id, to_char(performed_on, 'YYYY-MM-DD') AS performed_on, work_kind, problem_area, service_company_name,
            technician_name, hours_on_site, travel_hours, note, parts_used
       FROM machine_shop_records WHERE equipment_id = $1`,
    { bind: [machineId], type: QueryTypes.SELECT },
  );
}

function platformEntry(r: WorkOrderRow, attachments: HistoryAttachmentDto[]): HistoryEntryDto {
  return {
    key: `wo-${r.id}`,
    source: "platform",
    workOrderId: r.id,
    // The day the work was done, at the site: a job finished at 11 p.m. in Chicago is not the next day's.
    date: calendarDateIn(r.completed_at ?? r.confirmed_at, r.time_zone),
    kind: r.work_kind,
    problemArea: r.problem_area,
    serviceCompanyName: r.service_company_name,
    technicianName: r.technician_name,
    hoursOnSite: hours(r.hours_worked),
    travelHours: hours(r.travel_hours),
    note: r.completion_note,
    problem: r.problem,
    partsUsed: r.parts_used ?? [],
    attachments,
    standingSnapshot: r.snapshot_completed ? snapshotForBuyer(r.snapshot_completed) : null,
    repeatOf: null,
  };
}

function shopEntry(r: ShopRecordRow): HistoryEntryDto {
  return {
    key: `rec-${r.id}`,
    source: "shop_record",
    workOrderId: null,
    date: r.performed_on,
    kind: r.work_kind,
    problemArea: r.problem_area,
    serviceCompanyName: r.service_company_name,
    technicianName: r.technician_name,
    hoursOnSite: hours(r.hours_on_site),
    travelHours: hours(r.travel_hours),
    note: r.note,
    problem: null,
    partsUsed: r.parts_used ?? [],
    attachments: [],
    standingSnapshot: null,
    repeatOf: null,
  };
}

/**
 * What follows the machine to a shop that did not hold it at the time: the date, the kind of work and where, the
 * company, what was done and the parts. The people, hours, the problem in the other shop's words, the files and the
 * standing snapshot stay with the shop that owned it then.
 */
function carriedForm(entry: HistoryEntryDto): HistoryEntryDto {
  return {
    ...entry,
    workOrderId: null,
    technicianName: null,
    hoursOnSite: null,
    travelHours: null,
    problem: null,
    attachments: [],
    standingSnapshot: null,
  };
}

// A shop's own record carries a calendar day, not an instant: midday UTC keeps it on that day in every US zone.
const recordInstant = (r: ShopRecordRow) => new Date(`${r.performed_on}T12:00:00Z`);

/**
 * A machine's history as one shop may read it, newest first: its confirmed work orders and the shops' own records,
 * repeat faults marked. Entries from another owner's time come in their carried form; a former owner reads only up
 * to the day it handed the machine over.
 */
export async function listMachineHistory(
  machineId: number,
  readerCompanyId: number,
): Promise<MachineHistoryDto> {
  const [orders, records, periods] = await Promise.all([
    confirmedWorkOrders(machineId),
    shopRecords(machineId),
    ownershipPeriods(machineId),
  ]);
  // Work dated before the first recorded period (done before the machine was entered here) is the first owner's.
  if (periods[0]) periods[0] = { ...periods[0], from: new Date(0).toISOString() };
  const attachments = await attachmentsOf(orders.map((o) => o.id));
  const dated = [
    ...orders.map((o) => ({
      at: o.completed_at ?? o.confirmed_at,
      entry: platformEntry(o, attachments.get(o.id) ?? []),
    })),
    ...records.map((r) => ({ at: recordInstant(r), entry: shopEntry(r) })),
  ];
  const entries = dated.flatMap(({ at, entry }) => {
    const access = historyAccess(readerCompanyId, periods, new Date(at));
    return access === "none" ? [] : [access === "own" ? entry : carriedForm(entry)];
  });
  const repeats = findRepeatFaults(entries);
  const marked = entries.map((e) => ({ ...e, repeatOf: repeats.get(e.key) ?? null }));
  marked.sort((a, b) => b.date.localeCompare(a.date) || b.key.localeCompare(a.key));
  return { machineId, entries: marked };
}
