/** Shown while the first route module and its data load. */
export function RootFallback() {
  return (
    <div role="status" className="grid min-h-dvh place-items-center text-ink-700">
      <span className="flex items-center gap-2">
        <span
          aria-hidden="true"
          className="size-5 animate-spin rounded-full border-2 border-ink-300 border-r-transparent"
        />
        Loading Clearbench…
      </span>
    </div>
  );
}
