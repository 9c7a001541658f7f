/**
 * The instant a wall-clock time names in an IANA zone ("2027-03-15T08:30" in America/Chicago), or null when that time
 * does not exist there (skipped by a daylight-saving change). A time that occurs twice (the hour repeated in the fall)
 * is read as the first of the two. Pure: no clock, the zone is a parameter.
 */
export function instantFromLocal(local: string, timeZone: string): Date | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/.exec(local);
  if (!m) return null;
  const [y, mo, d, h, mi] = m.slice(1).map(Number) as [number, number, number, number, number];
  const wall = Date.UTC(y, mo - 1, d, h, mi);
  if (new Date(wall).getUTCDate() !== d) return null;
  // Try the zone's offsets around that day, earliest instant first, and keep one that reads back as the same wall time.
  const candidates = [-1, 0, 1]
    .map((days) => offsetMinutes(new Date(wall + days * 86_400_000), timeZone))
    .map((offset) => wall - offset * 60_000)
    .sort((a, b) => a - b);
  for (const instant of candidates) {
    if (instant + offsetMinutes(new Date(instant), timeZone) * 60_000 === wall) return new Date(instant);
  }
  return null;
}

/** The zone's offset from UTC at an instant, in minutes (Chicago in winter: -360). */
function offsetMinutes(instant: Date, timeZone: string): number {
  const parts = new Intl.DateTimeFormat("en-US", {
    timeZone,
    hourCycle: "h23",
    year: "numeric",
    month: "2-digit",
    day: "2-digit",
    hour: "2-digit",
    minute: "2-digit",
    second: "2-digit",
  }).formatToParts(instant);
  const part = (type: string) => Number(parts.find((p) => p.type === type)?.value ?? 0);
  const asUtc = Date.UTC(
    part("year"),
    part("month") - 1,
    part("day"),
    part("hour"),
    part("minute"),
    part("second"),
  );
  return Math.round((asUtc - Math.floor(instant.getTime() / 1000) * 1000) / 60_000);
}

/** The wall-clock time ("2027-03-15T08:30") an instant shows in a zone: what a date-time field there starts from. */
export function localFromInstant(instant: Date, timeZone: string): string {
  const shifted = new Date(instant.getTime() + offsetMinutes(instant, timeZone) * 60_000);
  return shifted.toISOString().slice(0, 16);
}
