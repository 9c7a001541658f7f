import { MS_PER_DAY } from "@shared/standing/warning-windows.ts";
import type { CredentialDto as Credential } from "@shared/credentials/credential-shapes.ts";

export type WeekBucket = { weekStart: string; label: string; count: number; names: string[] };

const weekLabel = new Intl.DateTimeFormat("en-US", { month: "short", day: "numeric" });

/** One bucket per week from today, for the timeline chart. */
export function byWeek(lapsing: readonly Credential[], now: Date, weeks: number): WeekBucket[] {
  const buckets: WeekBucket[] = Array.from({ length: weeks }, (_, i) => {
    const start = new Date(now.getTime() + i * 7 * MS_PER_DAY);
    return { weekStart: start.toISOString(), label: weekLabel.format(start), count: 0, names: [] };
  });
  for (const c of lapsing) {
    const index = Math.floor((new Date(c.lapsesAt!).getTime() - now.getTime()) / (7 * MS_PER_DAY));
    const bucket = buckets[index];
    if (bucket) {
      bucket.count += 1;
      bucket.names.push(`${c.typeName} (${c.technicianName ?? c.companyName})`);
    }
  }
  return buckets;
}
