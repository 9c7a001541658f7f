/** The product name with its mark: a bench line under a cleared check. */
export function Wordmark({ tone = "light" }: { tone?: "light" | "dark" }) {
  return (
    <span
      className={`flex items-center gap-2 text-lg font-semibold tracking-tight ${tone === "light" ? "text-white" : "text-ink-900"}`}
    >
      <svg viewBox="0 0 24 24" className="size-6" aria-hidden="true" focusable="false">
        <rect x="2" y="2" width="20" height="20" rx="5" className="fill-accent-500" />
        <path d="m7 11 3.25 3.25L17 7.5" className="fill-none stroke-ink-900" strokeWidth="2.25" />
        <path d="M6 18h12" className="stroke-ink-900" strokeWidth="2" />
      </svg>
      Clearbench
    </span>
  );
}
