import { Bar, BarChart, CartesianGrid, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { LapseTooltip } from "./lapse-tooltip.tsx";
import type { WeekBucket } from "./lapse-window.ts";

/**
 * Lapses per week over the coming weeks. The chart is a picture of the table beside it, so it is labelled
 * with a one-line summary and the table carries the details for screen readers.
 */
export function LapseTimelineChart({ weeks }: { weeks: WeekBucket[] }) {
  const total = weeks.reduce((sum, w) => sum + w.count, 0);
  const busiest = weeks.reduce<WeekBucket | null>(
    (best, w) => (w.count > (best?.count ?? 0) ? w : best),
    null,
  );
  const summary =
    total === 0
      ? "Nothing lapses in the coming weeks."
      : `${total} ${total === 1 ? "credential lapses" : "credentials lapse"} in the next ${weeks.length} weeks; the busiest week starts ${busiest?.label}.`;
  return (
    <figure className="rounded-lg border border-ink-100 bg-white p-4">
      <figcaption className="mb-2 text-sm text-ink-700">{summary}</figcaption>
      <div role="img" aria-label={`Timeline chart. ${summary}`} className="h-56 w-full">
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={weeks} margin={{ top: 8, right: 8, bottom: 8, left: 0 }}>
            <CartesianGrid strokeDasharray="3 3" stroke="#d9e1ee" vertical={false} />
            <XAxis dataKey="label" tick={{ fill: "#213a66", fontSize: 12 }} interval="preserveStartEnd" />
            <YAxis allowDecimals={false} width={28} tick={{ fill: "#213a66", fontSize: 12 }} />
            {/* Only a bar with lapses opens the card, and there is no grey band: resting the pointer on an
                empty week used to leave "Lapsing: 0" standing open. */}
            <Tooltip shared={false} cursor={false} content={LapseTooltip} />
            <Bar
              dataKey="count"
              name="Lapsing"
              fill="#213a66"
              isAnimationActive={false}
              radius={[3, 3, 0, 0]}
            />
          </BarChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}
