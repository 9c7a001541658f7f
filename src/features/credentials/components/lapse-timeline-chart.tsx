import { useEffect, useRef, useState } from "react";
import { countTicks, labelsShown } from "./lapse-chart-scale.ts";
import { LapseTooltip } from "./lapse-tooltip.tsx";
import type { WeekBucket } from "./lapse-window.ts";

const HEIGHT = 224;
const MARGIN = { top: 8, right: 8, bottom: 30, left: 28 };
const INK = "#213a66";
const GRID = "#d9e1ee";
// A label such as "Dec 12" at 12 px, with room between neighbours.
const LABEL_WIDTH = 52;

/** The container's width, followed as the layout changes. */
function useWidth() {
  const ref = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(0);
  useEffect(() => {
    const node = ref.current;
    if (!node) return;
    setWidth(node.clientWidth);
    const observer = new ResizeObserver(([entry]) => setWidth(entry?.contentRect.width ?? 0));
    observer.observe(node);
    return () => observer.disconnect();
  }, []);
  return [ref, width] as const;
}

/** A bar with its top corners rounded by r (less on a short bar). */
function barPath(x: number, y: number, w: number, h: number, r: number) {
  const c = Math.min(r, h, w / 2);
  return `M${x},${y + h}V${y + c}Q${x},${y} ${x + c},${y}H${x + w - c}Q${x + w},${y} ${x + w},${y + c}V${y + h}Z`;
}

/**
 * Lapses per week over the coming weeks. The chart is a picture of the table beside it, so it is labelled
 * with a one-line summary and the table carries the details for screen readers. Drawn as plain SVG: a
 * charting library was a quarter of the client's code for this one picture.
 */
export function LapseTimelineChart({ weeks }: { weeks: WeekBucket[] }) {
  const [ref, width] = useWidth();
  const [hovered, setHovered] = useState<number | null>(null);
  const total = weeks.reduce((sum, w) => sum + w.count, 0);
  const busiest = weeks.reduce<WeekBucket | null>(
    (best, w) => (w.count > (best?.count ?? 0) ? w : best),
    null,
  );
  const summary =
    total === 0
      ? "Nothing lapses in the coming weeks."
      : `${total} ${total === 1 ? "credential lapses" : "credentials lapse"} in the next ${weeks.length} weeks; the busiest week starts ${busiest?.label}.`;

  const ticks = countTicks(busiest?.count ?? 0);
  const top = ticks[ticks.length - 1]!;
  const plotWidth = Math.max(0, width - MARGIN.left - MARGIN.right);
  const plotHeight = HEIGHT - MARGIN.top - MARGIN.bottom;
  const band = weeks.length > 0 ? plotWidth / weeks.length : 0;
  const y = (count: number) => MARGIN.top + plotHeight - (count / top) * plotHeight;
  const hoveredWeek = hovered === null ? null : (weeks[hovered] ?? null);

  return (
    <figure className="rounded-lg border border-ink-100 bg-white p-4">
      <figcaption className="mb-2 text-sm text-ink-700">{summary}</figcaption>
      <div ref={ref} role="img" aria-label={`Timeline chart. ${summary}`} className="relative h-56 w-full">
        {width > 0 && (
          <svg width={width} height={HEIGHT} aria-hidden="true">
            {ticks.map((t) => (
              <g key={t}>
                <line
                  x1={MARGIN.left}
                  x2={MARGIN.left + plotWidth}
                  y1={y(t)}
                  y2={y(t)}
                  stroke={GRID}
                  strokeDasharray="3 3"
                />
                <text x={MARGIN.left - 6} y={y(t)} dy="0.32em" textAnchor="end" fill={INK} fontSize={12}>
                  {t}
                </text>
              </g>
            ))}
            {weeks.map((w, i) =>
              w.count > 0 ? (
                // Only a bar with lapses opens the card: an empty week has nothing to hover.
                <path
                  key={w.weekStart}
                  d={barPath(
                    MARGIN.left + i * band + band * 0.1,
                    y(w.count),
                    band * 0.8,
                    y(0) - y(w.count),
                    3,
                  )}
                  fill={INK}
                  onMouseEnter={() => setHovered(i)}
                  onMouseLeave={() => setHovered(null)}
                />
              ) : null,
            )}
            <line x1={MARGIN.left} x2={MARGIN.left + plotWidth} y1={y(0)} y2={y(0)} stroke={INK} />
            {labelsShown(weeks.length, band, LABEL_WIDTH).map((i) => (
              <text
                key={weeks[i]!.weekStart}
                x={MARGIN.left + (i + 0.5) * band}
                y={y(0) + 18}
                textAnchor="middle"
                fill={INK}
                fontSize={12}
              >
                {weeks[i]!.label}
              </text>
            ))}
          </svg>
        )}
        {hovered !== null && hoveredWeek && hoveredWeek.count > 0 && (
          <div
            className="pointer-events-none absolute z-10"
            style={{
              left: Math.min(MARGIN.left + (hovered + 1) * band, Math.max(0, width - 220)),
              top: MARGIN.top,
            }}
          >
            <LapseTooltip week={hoveredWeek} />
          </div>
        )}
      </div>
    </figure>
  );
}
