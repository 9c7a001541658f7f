import type { ReactNode } from "react";

type CautionProps = {
  /** The landmark's name, which screen readers list among the page's regions. */
  label: string;
  title: string;
  /** The one sentence always in view. */
  lead: ReactNode;
  /** The rest, folded until asked for. */
  points: readonly string[];
  moreLabel: string;
  className?: string;
};

function CautionIcon() {
  return (
    <svg viewBox="0 0 16 16" className="mt-0.5 size-4 shrink-0" aria-hidden="true" focusable="false">
      <path d="M8 1.5 15 14H1z" className="fill-none stroke-amber-800" strokeWidth="1.5" />
      <path d="M8 6v3.75M8 11.25v1" className="stroke-amber-800" strokeWidth="1.5" />
    </svg>
  );
}

/**
 * The one shape every caution takes: a title and one sentence in view, the points behind a fold, so a page that needs
 * a caution carries it in two lines rather than a block the reader learns to skip.
 */
export function Caution({ label, title, lead, points, moreLabel, className = "" }: CautionProps) {
  return (
    <aside
      aria-label={label}
      className={`rounded-md border-l-4 border-amber-700 bg-amber-50 px-4 py-2 text-sm text-ink-900 ${className}`}
    >
      <div className="flex gap-2">
        <CautionIcon />
        <p>
          <span className="font-semibold">{title}</span> {lead}
        </p>
      </div>
      {points.length > 0 && (
        <details className="group pl-6">
          <summary className="flex min-h-11 cursor-pointer items-center font-medium text-ink-900 underline underline-offset-2 focus-visible:outline-2 focus-visible:outline-ink-700">
            {moreLabel}
          </summary>
          <ul className="mb-1 list-disc space-y-1 pl-5">
            {points.map((p) => (
              <li key={p}>{p}</li>
            ))}
          </ul>
        </details>
      )}
    </aside>
  );
}
