import { daysUntil } from "../../shared/standing/warning-windows.ts";

/** One recipient of one notice, as the job's recipient query returns it. */
export interface NoticeRecipient {
  noticeId: number;
  thresholdDays: number;
  lapsesAt: Date;
  credentialId: number;
  typeCode: string;
  typeName: string;
  companyName: string;
  timeZone: string;
  technicianId: number | null;
  technicianName: string | null;
  userId: number;
  role: "provider_admin" | "technician";
  email: string;
  userName: string;
}

export interface RenderedNotice {
  subject: string;
  text: string;
  html: string;
  title: string;
  body: string;
  link: string;
  kind: "credential_lapsing" | "credential_lapsed";
}

const escapeHtml = (s: string) =>
  s
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&#39;");

/** The client's upload flow with the type (and holder) chosen already: the office's documents page, or a technician's own card upload. */
export function renewalPath(r: Pick<NoticeRecipient, "role" | "typeCode" | "technicianId">): string {
  const type = encodeURIComponent(r.typeCode);
  if (r.role === "technician") return `/technician/upload-card?type=${type}`;
  return r.technicianId === null
    ? `/provider/documents/new?type=${type}`
    : `/provider/documents/new?type=${type}&technicianId=${r.technicianId}`;
}

// One formatter per zone, made once: luxon built a zone-name formatter for every instant (about 170 us per e-mail, the
// largest share of queueing a run's ten thousand notices); formatToParts on a kept formatter gives the same words.
const lapseFormatters = new Map<string, Intl.DateTimeFormat>();

function lapseFormatter(timeZone: string): Intl.DateTimeFormat {
  let formatter = lapseFormatters.get(timeZone);
  if (!formatter) {
    formatter = new Intl.DateTimeFormat("en-US", {
      timeZone,
      weekday: "long",
      month: "long",
      day: "numeric",
      year: "numeric",
      hour: "numeric",
      minute: "2-digit",
      hour12: true,
      timeZoneName: "short",
    });
    lapseFormatters.set(timeZone, formatter);
  }
  return formatter;
}

/** The lapse instant on the recipient company's wall clock, e.g. "Thursday, July 15, 2027 at 1:01 AM CDT". */
export function formatLapseInstant(lapsesAt: Date, timeZone: string): string {
  const part: Partial<Record<Intl.DateTimeFormatPartTypes, string>> = {};
  for (const p of lapseFormatter(timeZone).formatToParts(lapsesAt)) part[p.type] = p.value;
  return `${part.weekday}, ${part.month} ${part.day}, ${part.year} at ${part.hour}:${part.minute} ${part.dayPeriod} ${part.timeZoneName}`;
}

/** Plain-text and HTML e-mail plus the in-app wording for one notice to one recipient. */
export function renderLapseNotice(r: NoticeRecipient, asOf: Date, publicUrl: string): RenderedNotice {
  const holder = r.technicianName ? `${r.technicianName} (${r.companyName})` : r.companyName;
  const when = formatLapseInstant(r.lapsesAt, r.timeZone);
  const link = `${publicUrl.replace(/\/$/, "")}${renewalPath(r)}`;
  const lapsed = r.thresholdDays === 0;
  const days = Math.max(daysUntil(r.lapsesAt, asOf), 0);
  const title = lapsed
    ? `Lapsed: ${r.typeName} for ${holder}`
    : `${r.typeName} for ${holder} lapses in ${days} day${days === 1 ? "" : "s"}`;
  const hidden = r.technicianName
    ? `${r.technicianName} is hidden from shops in the directory and cannot take new work orders`
    : `every technician of ${r.companyName} who needs it is hidden from shops in the directory and cannot take new work orders`;
  const body = lapsed
    ? `${r.typeName} held by ${holder} lapsed on ${when}. It no longer counts: ${hidden} until a renewal is uploaded and a Clearbench reviewer verifies it.`
    : `${r.typeName} held by ${holder} lapses on ${when}. If no verified renewal is on file by then, ${hidden}.`;
  const next = lapsed
    ? "Upload the renewal now; once a reviewer verifies it, the standing is restored."
    : "Upload the renewal before then, leaving a reviewer time to verify it.";
  const text = [
    `Hello ${r.userName},`,
    "",
    body,
    "",
    next,
    "",
    `Upload the renewal: ${link}`,
    "",
    "Clearbench",
  ].join("\n");
  const html = [
    `<p>Hello ${escapeHtml(r.userName)},</p>`,
    `<p>${escapeHtml(body)}</p>`,
    `<p><strong>${escapeHtml(next)}</strong></p>`,
    `<p><a href="${escapeHtml(link)}">Upload the renewal</a></p>`,
    "<p>Clearbench</p>",
  ].join("\n");
  return {
    subject: title,
    text,
    html,
    title,
    body,
    link,
    kind: lapsed ? "credential_lapsed" : "credential_lapsing",
  };
}
