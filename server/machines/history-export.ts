import Papa from "papaparse";
import {
  historyCsvColumns,
  historySourceLabels,
  problemAreaLabels,
  type HistoryEntryDto,
  type MachineHistoryDto,
  type PartUsed,
} from "../../shared/machines/service-history.ts";
import { requestKindLabels } from "../../shared/service-requests/schemas.ts";
import { formatCalendarDate } from "../../shared/dates/local-time.ts";
import { markSvg, statusMarks } from "../../shared/status/status-marks.ts";
import { INSURANCE_CAUTION } from "../../shared/safety/cautions.ts";
import type { EquipmentDto } from "../../shared/sites/schemas.ts";
import { formulaStart } from "../roster/index.ts";

export type MachineForExport = EquipmentDto & { siteName: string };

const kindWords = (e: HistoryEntryDto) => (e.kind ? requestKindLabels[e.kind] : "Not stated");
const areaWords = (e: HistoryEntryDto) => (e.problemArea ? problemAreaLabels[e.problemArea] : "");
const partWords = (p: PartUsed) =>
  `${p.quantity} × ${p.description}${p.partNumber ? ` (${p.partNumber})` : ""}`;
const repeatWords = (e: HistoryEntryDto, all: HistoryEntryDto[]) => {
  const earlier = e.repeatOf ? all.find((x) => x.key === e.repeatOf) : undefined;
  return earlier ? `Repeat of ${earlier.date}` : "";
};
const standingWords = (e: HistoryEntryDto) =>
  e.standingSnapshot ? statusMarks[e.standingSnapshot.standing].word : "";

/** One line per entry; dates are the site's calendar days, so the file sorts without a zone guess. */
export function historyToCsv(history: MachineHistoryDto): string {
  const data = history.entries.map((e) => [
    e.date,
    historySourceLabels[e.source],
    e.workOrderId === null ? "" : `#${e.workOrderId}`,
    kindWords(e),
    areaWords(e),
    repeatWords(e, history.entries),
    e.serviceCompanyName ?? "",
    e.technicianName ?? "",
    e.hoursOnSite === null ? "" : e.hoursOnSite.toFixed(2),
    e.travelHours === null ? "" : e.travelHours.toFixed(2),
    e.note ?? "",
    e.partsUsed.map(partWords).join("; "),
    e.attachments.map((a) => a.name).join("; "),
    standingWords(e),
  ]);
  return Papa.unparse({ fields: [...historyCsvColumns], data }, { escapeFormulae: formulaStart });
}

const escapeHtml = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c] ?? c,
  );

function entryRow(e: HistoryEntryDto, all: HistoryEntryDto[]): string {
  const standing = e.standingSnapshot
    ? `${markSvg(e.standingSnapshot.standing)} ${escapeHtml(statusMarks[e.standingSnapshot.standing].word)}`
    : "";
  const cells = [
    escapeHtml(formatCalendarDate(e.date)),
    escapeHtml(historySourceLabels[e.source]) + (e.workOrderId ? ` #${e.workOrderId}` : ""),
    escapeHtml(kindWords(e)) + (e.problemArea ? `<br>${escapeHtml(areaWords(e))}` : ""),
    e.repeatOf ? `<strong>${escapeHtml(repeatWords(e, all))}</strong>` : "",
    escapeHtml([e.serviceCompanyName, e.technicianName].filter(Boolean).join(", ")),
    escapeHtml([e.hoursOnSite, e.travelHours].map((h) => (h === null ? "–" : h.toFixed(2))).join(" / ")),
    escapeHtml(e.note ?? ""),
    escapeHtml(e.partsUsed.map(partWords).join("; ")),
    escapeHtml(e.attachments.map((a) => a.name).join("; ")),
    standing,
  ];
  return `<tr>${cells.map((c) => `<td>${c}</td>`).join("")}</tr>`;
}

/** The printable history: every value escaped, nothing loaded from anywhere. */
export function renderHistoryPage(machine: MachineForExport, history: MachineHistoryDto): string {
  const title = `${machine.builder} ${machine.model}${machine.serialNumber ? `, serial ${machine.serialNumber}` : ""}`;
  const rows = history.entries.map((e) => entryRow(e, history.entries)).join("");
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Service history: ${escapeHtml(title)}</title>
<style>
body{font-family:"Work Sans",system-ui,sans-serif;color:#14213d;margin:2rem;font-size:12px}
table{border-collapse:collapse;width:100%}th,td{border:1px solid #8a94a6;padding:4px;text-align:left;vertical-align:top}
td svg{vertical-align:-1px}
@media print{body{margin:0}}
</style></head><body>
<h1>Service history: ${escapeHtml(title)}</h1>
<p>${escapeHtml(machine.controlFamily)} control, at ${escapeHtml(machine.siteName)}${machine.building ? `, building ${escapeHtml(machine.building)}` : ""}${machine.bay ? `, ${escapeHtml(machine.bay)}` : ""}. Dates are the site's calendar days.</p>
${
  rows
    ? `<table><thead><tr><th>Date</th><th>Source</th><th>Kind of work</th><th>Repeat fault</th><th>Service company, technician</th><th>Hours on site / travel</th><th>What was done</th><th>Parts used</th><th>Attachments</th><th>Standing at completion</th></tr></thead><tbody>${rows}</tbody></table>`
    : "<p>No service is on record for this machine yet.</p>"
}
<p><small>Entries marked "${escapeHtml(historySourceLabels.shop_record)}" were written by the shop and never count toward ratings. A repeat fault is a repair in the same problem area within 90 days of the one before. ${escapeHtml(INSURANCE_CAUTION)}</small></p>
</body></html>`;
}
