import type { DirectoryRowDto as DirectoryRow } from "@shared/directory/directory-shapes.ts";

/**
 * How each line of the chosen requirement set is met, folded into one line per result so the list stays scannable;
 * open it to see the stacked limits ("GL $1M + umbrella $4M each occurrence") and the dates.
 */
export function RequirementsMetLine({ row }: { row: Pick<DirectoryRow, "name" | "requirementsMet"> }) {
  const lines = row.requirementsMet;
  if (!lines || lines.length === 0) return null;
  return (
    <details className="group text-sm">
      <summary className="inline-flex min-h-11 cursor-pointer items-center text-ink-800 underline underline-offset-2 md:min-h-0">
        How {lines.length === 1 ? "the requirement is" : `the ${lines.length} requirements are`} met
        <span className="sr-only"> for {row.name}</span>
      </summary>
      <ul className="mt-1 space-y-1">
        {lines.map((line) => (
          <li key={line.label} className="break-words">
            <span className="font-medium text-ink-900">{line.label}:</span>{" "}
            <span className="text-ink-800">{line.metBy ?? line.detail}</span>
            {line.lapsing && <span className="text-amber-900"> (lapsing)</span>}
            {line.metBy && <span className="block text-xs text-ink-700">{line.detail}</span>}
          </li>
        ))}
      </ul>
    </details>
  );
}
