import { useId } from "react";

/** How much of the file has gone up; a real progress element, so screen readers announce it too. */
export function UploadProgress({ fileName, fraction }: { fileName: string; fraction: number }) {
  const id = useId();
  const percent = Math.round(fraction * 100);
  const reading = percent >= 100;
  return (
    <div className="space-y-2 rounded-lg border border-ink-100 bg-white px-4 py-4">
      <label htmlFor={id} className="block text-sm font-medium text-ink-900">
        {reading ? `Reading ${fileName}…` : `Uploading ${fileName}`}
      </label>
      <progress
        id={id}
        max={100}
        value={percent}
        className="h-3 w-full overflow-hidden rounded-full [&::-moz-progress-bar]:bg-ink-700 [&::-webkit-progress-bar]:bg-ink-100 [&::-webkit-progress-value]:bg-ink-700"
      />
      <p className="text-sm text-ink-700" aria-live="polite">
        {reading ? "Uploaded. Reading the fields from the document…" : `${percent} % sent`}
      </p>
    </div>
  );
}
