import { INSURANCE_CAUTION } from "@shared/safety/cautions.ts";

function CautionIcon() {
  return (
    <svg viewBox="0 0 16 16" className="mt-0.5 size-4 shrink-0" aria-hidden="true" focusable="false">
      <path d="M8 1.5 15 14H1z" className="fill-none stroke-amber-800" strokeWidth="1.5" />
      <path d="M8 6v3.75M8 11.25v1" className="stroke-amber-800" strokeWidth="1.5" />
    </svg>
  );
}

/** The caution wherever a certificate of insurance is shown or relied on. */
export function CautionNote({ className = "" }: { className?: string }) {
  return (
    <aside
      aria-label="About certificates of insurance"
      className={`flex gap-3 rounded-md border border-amber-700/30 bg-amber-50 px-4 py-3 text-sm text-ink-900 ${className}`}
    >
      <CautionIcon />
      <p>
        <span className="font-semibold">Certificates of insurance.</span> {INSURANCE_CAUTION} It does not
        change the policy it describes.
      </p>
    </aside>
  );
}
