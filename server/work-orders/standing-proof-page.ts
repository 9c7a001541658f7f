import { formatLocalDateTime } from "../../shared/dates/local-time.ts";
import {
  CLEARED_MEANS,
  INSURANCE_CAUTION,
  LICENSE_CAUTION,
  SAFETY_CAUTIONS,
  SAFETY_CAUTION_TITLE,
} from "../../shared/safety/cautions.ts";
import { markSvg, statusMarks, type StatusMeaning } from "../../shared/status/status-marks.ts";
import { technologyLabels, type MachineTechnology } from "../../shared/technicians/schemas.ts";
import type { StandingSnapshot } from "../../shared/work-orders/standing-snapshot.ts";

const escapeHtml = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c] ?? c,
  );

// The same shapes and words as the screens (shared/status/status-marks.ts), drawn inline so the page loads nothing.
const status = (meaning: StatusMeaning) =>
  `<span class="status">${markSvg(meaning)} ${escapeHtml(statusMarks[meaning].word)}</span>`;

export interface ProofSubject {
  workOrderId: number;
  shopName: string;
  siteName: string;
  technology: string;
  /** The site's zone: every time on the page is local to where the work is done, with the zone named. */
  timeZone: string;
  /** The job sheet, only for a reader allowed to see it (the shop, or the service side once accepted). */
  onSite?: [string, string][];
  arrivalAt?: string | null;
}

const technologyWords = (code: string) => technologyLabels[code as MachineTechnology] ?? code;

function section(title: string, snapshot: StandingSnapshot, timeZone: string): string {
  const targets = snapshot.targets
    .map((t) => {
      const rows = t.requirements
        .map((r) => {
          const c = r.credential;
          return `<tr><td>${escapeHtml(r.label)}</td><td>${status(r.status)}</td>
            <td>${c ? escapeHtml(c.typeName) : "None on file"}</td>
            <td>${escapeHtml(c?.reference ?? "")}</td><td>${escapeHtml(c ? (c.lapsesAt ? formatLocalDateTime(c.lapsesAt, timeZone) : "Does not lapse") : "")}</td>
            <td>${escapeHtml(r.detail)}</td></tr>`;
        })
        .join("");
      return `<h3>${escapeHtml(t.name)}: ${status(t.standing)}</h3>
        <table><thead><tr><th>Requirement</th><th>Status</th><th>Credential</th><th>Policy or card number</th><th>Lapses</th><th>Detail</th></tr></thead>
        <tbody>${rows}</tbody></table>`;
    })
    .join("");
  return `<section><h2>${escapeHtml(title)}</h2>
    <p>Taken <strong>${escapeHtml(formatLocalDateTime(snapshot.takenAt, timeZone))}</strong>. Overall: <strong>${status(snapshot.standing)}</strong></p>
    ${targets}</section>`;
}

const legend = (): string =>
  `<h2>What the shapes mean</h2><ul class="legend">${(
    ["cleared", "lapsing", "not_cleared", "met", "unmet"] as const
  )
    .map((m) => `<li>${status(m)}: ${escapeHtml(statusMarks[m].explains)}</li>`)
    .join("")}</ul>`;

function jobSheet(subject: ProofSubject): string {
  if (!subject.onSite) return "";
  const rows = [
    ...(subject.arrivalAt
      ? [["Arrival", formatLocalDateTime(subject.arrivalAt, subject.timeZone)] as [string, string]]
      : []),
    ...subject.onSite,
  ]
    .map(
      ([label, value]) => `<tr><th scope="row">${escapeHtml(label)}</th><td>${escapeHtml(value)}</td></tr>`,
    )
    .join("");
  return `<section><h2>On site</h2><table><tbody>${rows}</tbody></table></section>`;
}

/** A printable page of the standing snapshots: every value is escaped, and the page loads nothing from anywhere. */
export function renderStandingProof(
  subject: ProofSubject,
  snapshots: { title: string; snapshot: StandingSnapshot }[],
): string {
  const first = snapshots[0]?.snapshot;
  const body = snapshots.length
    ? snapshots.map((s) => section(s.title, s.snapshot, subject.timeZone)).join("")
    : "<p>No snapshot has been taken yet: one is taken when the technician accepts and another when the work is completed.</p>";
  const number = escapeHtml(String(subject.workOrderId));
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Proof of standing, work order #${number}</title>
<style>
body{font-family:"Work Sans",system-ui,sans-serif;color:#14213d;margin:2rem;font-size:12px}
table{border-collapse:collapse;width:100%;margin-bottom:1rem}th,td{border:1px solid #8a94a6;padding:4px;text-align:left;vertical-align:top}
.status{white-space:nowrap}.status svg{vertical-align:-1px}.legend{list-style:none;padding:0}
.caution{border-left:4px solid #b45309;padding:4px 8px;margin:1rem 0}
@media print{body{margin:0}}
</style></head><body>
<h1>Proof of standing: work order #${number}</h1>
<p>${escapeHtml(first?.technicianName ?? "")}${first ? ` of ${escapeHtml(first.companyName)}` : ""}, for ${escapeHtml(subject.shopName)} at ${escapeHtml(subject.siteName)} (${escapeHtml(technologyWords(subject.technology))}). Times are local to the site.</p>
<div class="caution"><strong>${escapeHtml(SAFETY_CAUTION_TITLE)}.</strong> ${escapeHtml(CLEARED_MEANS)}<ul>${SAFETY_CAUTIONS.map((s) => `<li>${escapeHtml(s)}</li>`).join("")}<li>${escapeHtml(LICENSE_CAUTION)}</li></ul></div>
${jobSheet(subject)}
${body}
${legend()}
<p><small>Computed by Clearbench from verified credentials on file at the moment shown. ${escapeHtml(INSURANCE_CAUTION)} Follow local codes, site safety rules and licensed practice.</small></p>
</body></html>`;
}
