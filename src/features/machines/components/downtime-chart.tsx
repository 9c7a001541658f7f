import type { MachineDowntimeDto } from "@shared/machines/downtime-schemas.ts";

const monthName = new Intl.DateTimeFormat("en-US", { month: "short", timeZone: "UTC" });
const monthWords = (month: string) => monthName.format(new Date(`${month}-01T12:00:00Z`));
const yearOf = (month: string) => month.slice(0, 4);

const WIDTH = 360;
const HEIGHT = 120;
const BASE = 100;

/**
 * Hours down per month as small bars, oldest month on the left. The numbers are in the table under it for screen
 * readers and for anyone who wants the figure rather than the shape.
 */
export function DowntimeChart({ months }: { months: MachineDowntimeDto["months"] }) {
  const peak = Math.max(1, ...months.map((m) => m.hours));
  const slot = WIDTH / months.length;
  const first = months[0]?.month ?? "";
  const last = months.at(-1)?.month ?? "";
  return (
    <figure>
      <svg
        viewBox={`0 0 ${WIDTH} ${HEIGHT}`}
        className="h-32 w-full"
        role="img"
        aria-label={`Hours down per month, ${monthWords(first)} ${yearOf(first)} to ${monthWords(last)} ${yearOf(last)}`}
      >
        <line x1="0" x2={WIDTH} y1={BASE} y2={BASE} className="stroke-ink-300" strokeWidth="1" />
        {months.map((m, i) => {
          const height = (m.hours / peak) * (BASE - 14);
          return (
            <g key={m.month}>
              <rect
                x={i * slot + slot * 0.2}
                y={BASE - height}
                width={slot * 0.6}
                height={height}
                className="fill-accent-700"
                data-month={m.month}
              />
              {m.hours > 0 && (
                <text
                  x={i * slot + slot / 2}
                  y={BASE - height - 3}
                  textAnchor="middle"
                  className="fill-ink-900 text-[9px]"
                >
                  {Math.round(m.hours)}
                </text>
              )}
              <text
                x={i * slot + slot / 2}
                y={HEIGHT - 6}
                textAnchor="middle"
                className="fill-ink-700 text-[9px]"
              >
                {monthWords(m.month)}
              </text>
            </g>
          );
        })}
      </svg>
      <figcaption className="sr-only">
        <table>
          <caption>Hours down per month</caption>
          <tbody>
            {months.map((m) => (
              <tr key={m.month}>
                <th scope="row">
                  {monthWords(m.month)} {yearOf(m.month)}
                </th>
                <td>{m.hours} h</td>
              </tr>
            ))}
          </tbody>
        </table>
      </figcaption>
    </figure>
  );
}
