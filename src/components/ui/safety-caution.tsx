import { useId } from "react";
import {
  CLEARED_MEANS,
  LICENSE_CAUTION,
  RIGGING_CAUTION,
  SAFETY_CAUTIONS,
  SAFETY_CAUTION_TITLE,
} from "@shared/safety/cautions.ts";

/**
 * What "Cleared" means and the safety rules it never replaces, first and in plain sight wherever someone decides who
 * works on a machine or relies on a technician's papers.
 */
export function SafetyCaution({ className = "" }: { className?: string }) {
  const titleId = useId();
  return (
    <aside
      aria-labelledby={titleId}
      className={`rounded-md border-l-4 border-amber-700 bg-amber-50 px-4 py-3 text-sm text-ink-900 ${className}`}
    >
      <h2 id={titleId} className="font-semibold">
        {SAFETY_CAUTION_TITLE}
      </h2>
      <p className="mt-1">{CLEARED_MEANS}</p>
      <ul className="mt-2 list-disc space-y-1 pl-5">
        {SAFETY_CAUTIONS.map((s) => (
          <li key={s}>{s}</li>
        ))}
        <li>{LICENSE_CAUTION}</li>
        <li>{RIGGING_CAUTION}</li>
      </ul>
    </aside>
  );
}
