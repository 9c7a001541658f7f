import { useId } from "react";

export type Choice = { value: string; label: string; hint?: string };

type ChoiceGroupProps = {
  legend: string;
  name: string;
  options: readonly Choice[];
  defaultValue?: string;
  error?: string | undefined;
};

/** Radio buttons in a fieldset; each choice is a large card so it is easy to hit on a phone. */
export function ChoiceGroup({ legend, name, options, defaultValue, error }: ChoiceGroupProps) {
  const id = useId();
  const errorId = error ? `${id}-error` : undefined;
  return (
    <fieldset aria-describedby={errorId}>
      <legend className="mb-2 text-sm font-medium text-ink-900">{legend}</legend>
      <div className="grid gap-2 sm:grid-cols-2">
        {options.map((option, index) => (
          <label
            key={option.value}
            className="flex cursor-pointer gap-3 rounded-md border border-ink-300 bg-white p-3 has-checked:border-ink-700 has-checked:bg-ink-50 has-focus-visible:outline-2 has-focus-visible:outline-offset-1 has-focus-visible:outline-ink-700"
          >
            <input
              type="radio"
              name={name}
              value={option.value}
              defaultChecked={option.value === defaultValue}
              data-field={index === 0 ? name : undefined}
              className="mt-1 size-4 accent-ink-700"
            />
            <span>
              <span className="block font-medium text-ink-900">{option.label}</span>
              {option.hint && <span className="block text-sm text-ink-700">{option.hint}</span>}
            </span>
          </label>
        ))}
      </div>
      {error && (
        <p id={errorId} className="mt-1 text-sm font-medium text-red-800">
          {error}
        </p>
      )}
    </fieldset>
  );
}
