const calendarDate = new Intl.DateTimeFormat("en-US", { dateStyle: "medium", timeZone: "UTC" });
const instantDate = new Intl.DateTimeFormat("en-US", { dateStyle: "medium" });

/**
 * A calendar date as printed on a document ("2027-07-15" → "Jul 15, 2027"). Read at UTC on purpose: a plain
 * `new Date("2027-07-15")` shown in a zone west of UTC would print the day before (common practice).
 */
export function formatIsoDate(iso: string | null | undefined): string {
  if (!iso) return "—";
  const date = new Date(`${iso.slice(0, 10)}T00:00:00Z`);
  return Number.isNaN(date.getTime()) ? iso : calendarDate.format(date);
}

/** The day of an instant in the viewer's own zone, e.g. a lapse instant → "Jul 15, 2027". */
export function formatInstantDate(iso: string | null | undefined): string {
  if (!iso) return "—";
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : instantDate.format(date);
}

/** A wait in hours as people say it: "3 d 4 h", "5 h", "under 1 h". */
export function formatWaiting(hours: number): string {
  const whole = Math.floor(hours);
  if (whole < 1) return "under 1 h";
  const days = Math.floor(whole / 24);
  const rest = whole % 24;
  return days === 0 ? `${rest} h` : `${days} d ${rest} h`;
}
