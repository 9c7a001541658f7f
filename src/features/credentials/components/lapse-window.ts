import type { Credential } from "../api/credential-shapes.ts";

const DAY_MS = 24 * 60 * 60 * 1000;

/** Credentials that count today and stop counting within `days`, soonest first. */
export function lapsingWithin(credentials: readonly Credential[], now: Date, days: number): Credential[] {
  const end = now.getTime() + days * DAY_MS;
  return credentials
    .filter((c) => (c.state === "verified" || c.state === "submitted") && c.lapsesAt !== null)
    .filter((c) => {
      const at = new Date(c.lapsesAt!).getTime();
      return at > now.getTime() && at <= end;
    })
    .sort((a, b) => a.lapsesAt!.localeCompare(b.lapsesAt!));
}

export type WeekBucket = { weekStart: string; label: string; count: number; names: string[] };

const weekLabel = new Intl.DateTimeFormat("en-US", { month: "short", day: "numeric" });

/** One bucket per week from today, for the timeline chart. */
export function byWeek(lapsing: readonly Credential[], now: Date, weeks: number): WeekBucket[] {
  const buckets: WeekBucket[] = Array.from({ length: weeks }, (_, i) => {
    const start = new Date(now.getTime() + i * 7 * DAY_MS);
    return { weekStart: start.toISOString(), label: weekLabel.format(start), count: 0, names: [] };
  });
  for (const c of lapsing) {
    const index = Math.floor((new Date(c.lapsesAt!).getTime() - now.getTime()) / (7 * DAY_MS));
    const bucket = buckets[index];
    if (bucket) {
      bucket.count += 1;
      bucket.names.push(`${c.typeName} (${c.technicianName ?? c.companyName})`);
    }
  }
  return buckets;
}
