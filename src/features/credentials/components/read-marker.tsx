/** Tells the uploader (or reviewer) a value came from the document's text, so it needs a human check. */
export function ReadMarker({ id }: { id: string }) {
  return (
    <p id={id} className="flex items-center gap-1.5 text-sm font-medium text-ink-700">
      <svg viewBox="0 0 16 16" className="size-3.5 shrink-0" aria-hidden="true" focusable="false">
        <path d="M2 3h8l4 4v6H2z" className="fill-none stroke-ink-700" strokeWidth="1.5" />
        <path d="M5 8h6M5 11h4" className="stroke-ink-700" strokeWidth="1.5" />
      </svg>
      Read from the document — check it
    </p>
  );
}
