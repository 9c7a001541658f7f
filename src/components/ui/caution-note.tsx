/** The caution wherever a certificate of insurance is shown or relied on. */
export function CautionNote({ className = "" }: { className?: string }) {
  return (
    <aside
      aria-label="About certificates of insurance"
      className={`flex gap-3 rounded-md border border-amber-700/30 bg-amber-50 px-4 py-3 text-sm text-ink-900 ${className}`}
    >
      <svg viewBox="0 0 16 16" className="mt-0.5 size-4 shrink-0" aria-hidden="true" focusable="false">
        <path d="M8 1.5 15 14H1z" className="fill-none stroke-amber-800" strokeWidth="1.5" />
        <path d="M8 6v3.75M8 11.25v1" className="stroke-amber-800" strokeWidth="1.5" />
      </svg>
      <p>
        <span className="font-semibold">A certificate of insurance is information only.</span> It confers no
        rights on the certificate holder and does not change the policy it describes. Confirm coverage with
        the insurer or broker before relying on it, and follow local codes, site safety rules and licensed
        practice.
      </p>
    </aside>
  );
}
