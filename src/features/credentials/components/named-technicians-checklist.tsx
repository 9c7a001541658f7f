import { useId } from "react";
import type { HolderOption } from "./upload-flow.tsx";

type NamedTechniciansChecklistProps = {
  technicians: readonly HolderOption[];
  checked: readonly number[];
  onChange: (ids: number[]) => void;
  error?: string | undefined;
  disabled?: boolean | undefined;
};

/**
 * Which of the company's technicians the exemption names: only they are cleared by it, so every other technician
 * still needs a workers' compensation policy.
 */
export function NamedTechniciansChecklist({
  technicians,
  checked,
  onChange,
  error,
  disabled,
}: NamedTechniciansChecklistProps) {
  const hintId = useId();
  const errorId = useId();
  const toggle = (id: number, on: boolean) =>
    onChange(on ? [...checked, id] : checked.filter((other) => other !== id));
  return (
    <fieldset
      className="rounded-md border border-ink-100 p-4"
      aria-describedby={error ? `${hintId} ${errorId}` : hintId}
    >
      <legend className="px-1 text-sm font-semibold text-ink-900">Technicians the exemption names</legend>
      <p id={hintId} className="mb-3 text-sm text-ink-700">
        Tick each technician who is a person named on the exemption (the sole proprietor or an officer). Only
        they are cleared by it; every other technician still needs a workers&apos; compensation policy.
      </p>
      {technicians.length === 0 ? (
        <p className="text-sm text-ink-700">Your company has no technicians yet.</p>
      ) : (
        <ul className="grid gap-2 sm:grid-cols-2">
          {technicians.map((t) => (
            <li key={t.id}>
              <label className="flex min-h-11 items-center gap-3 text-sm text-ink-900">
                <input
                  type="checkbox"
                  className="size-5"
                  checked={checked.includes(t.id)}
                  onChange={(event) => toggle(t.id, event.currentTarget.checked)}
                  disabled={disabled}
                />
                <span className="min-w-0 break-words">{t.name}</span>
              </label>
            </li>
          ))}
        </ul>
      )}
      {error && (
        <p id={errorId} role="alert" className="mt-2 text-sm font-medium text-red-800">
          {error}
        </p>
      )}
    </fieldset>
  );
}
