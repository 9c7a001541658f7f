import type { ReviewerWarningDto as ReviewerWarningView } from "@shared/credentials/credential-shapes.ts";

/** Checks that help a reviewer look twice; warnings, never refusals. */
export function ReviewerWarnings({
  warnings,
  title = "Points to check",
}: {
  warnings: readonly ReviewerWarningView[];
  title?: string;
}) {
  if (warnings.length === 0) return null;
  return (
    <section
      aria-label={title}
      className="rounded-md border border-amber-700/40 bg-amber-50 px-4 py-3 text-sm text-ink-900"
    >
      <h3 className="flex items-center gap-2 font-semibold">
        <svg viewBox="0 0 16 16" className="size-4 shrink-0" aria-hidden="true" focusable="false">
          <path d="M8 1.5 15 14H1z" className="fill-none stroke-amber-800" strokeWidth="1.5" />
          <path d="M8 6v3.75M8 11.25v1" className="stroke-amber-800" strokeWidth="1.5" />
        </svg>
        {title} ({warnings.length})
      </h3>
      <ul className="mt-1 list-disc space-y-0.5 pl-6">
        {warnings.map((warning) => (
          <li key={`${warning.code}-${warning.message}`}>
            <span className="font-medium">Warning:</span> {warning.message}
          </li>
        ))}
      </ul>
    </section>
  );
}
