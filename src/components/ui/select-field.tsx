import { useId, type SelectHTMLAttributes } from "react";
import { fieldInputStyles } from "./text-field.tsx";

export type SelectOption = { value: string; label: string };

type SelectFieldProps = Omit<SelectHTMLAttributes<HTMLSelectElement>, "id"> & {
  label: string;
  name: string;
  options: readonly SelectOption[];
  /** A first, empty choice such as "Choose a company". */
  placeholder?: string;
  error?: string | undefined;
  hint?: string;
};

export function SelectField({
  label,
  name,
  options,
  placeholder,
  error,
  hint,
  className = "",
  ...rest
}: SelectFieldProps) {
  const id = `field-${name}-${useId()}`;
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  return (
    <div className={`space-y-1 ${className}`}>
      <label htmlFor={id} className="block text-sm font-medium text-ink-900">
        {label}
      </label>
      {hint && (
        <p id={hintId} className="text-sm text-ink-700">
          {hint}
        </p>
      )}
      <select
        id={id}
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={[hintId, errorId].filter(Boolean).join(" ") || undefined}
        data-field={name}
        className={`${fieldInputStyles} ${error ? "border-red-700" : "border-ink-300"}`}
        {...rest}
      >
        {placeholder !== undefined && <option value="">{placeholder}</option>}
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      {error && (
        <p id={errorId} className="text-sm font-medium text-red-800">
          {error}
        </p>
      )}
    </div>
  );
}
