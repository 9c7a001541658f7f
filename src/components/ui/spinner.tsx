export function Spinner({ label = "Loading" }: { label?: string }) {
  return (
    <div role="status" className="flex items-center gap-2 py-6 text-ink-700">
      <span
        aria-hidden="true"
        className="size-5 animate-spin rounded-full border-2 border-ink-300 border-r-transparent"
      />
      <span>{label}…</span>
    </div>
  );
}
