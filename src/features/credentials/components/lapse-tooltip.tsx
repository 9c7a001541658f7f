import type { WeekBucket } from "./lapse-window.ts";

/** The hover card for one week's bar; an empty week has no bar to hover, so it shows nothing. */
export function LapseTooltip({ week }: { week: WeekBucket | null }) {
  if (!week || week.count === 0) return null;
  return (
    <div className="rounded-md border border-ink-100 bg-white px-3 py-2 text-sm text-ink-900 shadow-md">
      <p className="font-semibold">Week of {week.label}</p>
      <ul className="mt-1">
        {week.names.map((name, i) => (
          <li key={`${i}-${name}`}>{name}</li>
        ))}
      </ul>
    </div>
  );
}
