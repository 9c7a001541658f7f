import type { StandingSnapshot } from "../../shared/work-orders/standing-snapshot.ts";

const escapeHtml = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c] ?? c,
  );

const WORDS = {
  cleared: "Cleared",
  lapsing: "Lapsing",
  not_cleared: "Not cleared",
  met: "Met",
  unmet: "Not met",
} as const;
// A status is never colour alone: each word carries a shape too.
const SHAPES = { cleared: "●", met: "●", lapsing: "▲", not_cleared: "■", unmet: "■" } as const;

export interface ProofSubject {
  workOrderId: number;
  shopName: string;
  siteName: string;
  technology: string;
}

function section(title: string, snapshot: StandingSnapshot): string {
  const targets = snapshot.targets
    .map((t) => {
      const rows = t.requirements
        .map((r) => {
          const c = r.credential;
          return `<tr><td>${escapeHtml(r.label)}</td><td>${SHAPES[r.status]} ${escapeHtml(WORDS[r.status])}</td>
            <td>${c ? `${escapeHtml(c.typeName)} #${escapeHtml(String(c.id))}` : "None on file"}</td>
            <td>${escapeHtml(c?.reference ?? "")}</td><td>${escapeHtml(c?.lapsesAt ?? (c ? "Does not expire" : ""))}</td>
            <td>${escapeHtml(r.detail)}</td></tr>`;
        })
        .join("");
      return `<h3>${escapeHtml(t.name)}: ${SHAPES[t.standing]} ${escapeHtml(WORDS[t.standing])}</h3>
        <table><thead><tr><th>Requirement</th><th>Status</th><th>Credential</th><th>Policy or card number</th><th>Lapses at (UTC)</th><th>Detail</th></tr></thead>
        <tbody>${rows}</tbody></table>`;
    })
    .join("");
  return `<section><h2>${escapeHtml(title)}</h2>
    <p>Taken at <strong>${escapeHtml(snapshot.takenAt)}</strong> (UTC). Overall: <strong>${SHAPES[snapshot.standing]} ${escapeHtml(WORDS[snapshot.standing])}</strong></p>
    ${targets}</section>`;
}

/** A printable page of the standing snapshots: every value is escaped, and the page loads nothing from anywhere. */
export function renderStandingProof(
  subject: ProofSubject,
  snapshots: { title: string; snapshot: StandingSnapshot }[],
): string {
  const first = snapshots[0]?.snapshot;
  const body = snapshots.length
    ? snapshots.map((s) => section(s.title, s.snapshot)).join("")
    : "<p>No snapshot has been taken yet: one is taken when the technician accepts and another when the work is completed.</p>";
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Proof of standing, work order #${escapeHtml(String(subject.workOrderId))}</title>
<style>
body{font-family:"Work Sans",system-ui,sans-serif;color:#14213d;margin:2rem;font-size:12px}
table{border-collapse:collapse;width:100%;margin-bottom:1rem}th,td{border:1px solid #8a94a6;padding:4px;text-align:left;vertical-align:top}
@media print{body{margin:0}}
</style></head><body>
<h1>Proof of standing: work order #${escapeHtml(String(subject.workOrderId))}</h1>
<p>${escapeHtml(first?.technicianName ?? "")}${first ? ` of ${escapeHtml(first.companyName)}` : ""}, for ${escapeHtml(subject.shopName)} at ${escapeHtml(subject.siteName)} (${escapeHtml(subject.technology)}).</p>
${body}
<p><small>Computed by Clearbench from verified credentials on file at the instant shown. A certificate of insurance is information only and confers no rights; confirm coverage with the insurer or broker, and follow local codes, site safety rules and licensed practice.</small></p>
</body></html>`;
}
