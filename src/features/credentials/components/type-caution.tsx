import type { CredentialType } from "../api/credential-shapes.ts";

/** The chosen type's own caution (from the catalog), shown before the file is sent. */
export function TypeCaution({ type }: { type: CredentialType }) {
  if (!type.caution) return null;
  return (
    <aside
      aria-label={`Caution: ${type.name}`}
      className="flex gap-3 rounded-md border border-amber-700/30 bg-amber-50 px-4 py-3 text-sm text-ink-900"
    >
      <svg viewBox="0 0 16 16" className="mt-0.5 size-4 shrink-0" aria-hidden="true" focusable="false">
        <path d="M8 1.5 15 14H1z" className="fill-none stroke-amber-800" strokeWidth="1.5" />
        <path d="M8 6v3.75M8 11.25v1" className="stroke-amber-800" strokeWidth="1.5" />
      </svg>
      <p>
        <span className="font-semibold">{type.name}.</span> {type.caution}
      </p>
    </aside>
  );
}
