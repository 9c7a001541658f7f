import { useId, type ReactNode } from "react";
import { fieldInputStyles } from "./field-styles.ts";

/** What a control needs so its label, hint and error belong to it (and the error summary can focus it). */
export type FieldControl = {
  id: string;
  name: string;
  "aria-invalid": true | undefined;
  "aria-describedby": string | undefined;
  "data-field": string;
  className: string;
};

type FieldProps = {
  label: string;
  name: string;
  error?: string | undefined;
  hint?: string | undefined;
  className?: string | undefined;
  children: (control: FieldControl) => ReactNode;
};

/** A label, an optional hint and an optional error around one control, tied to it with aria-describedby. */
export function Field({ label, name, error, hint, className = "", children }: FieldProps) {
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
      {children({
        id,
        name,
        "aria-invalid": error ? true : undefined,
        "aria-describedby": [hintId, errorId].filter(Boolean).join(" ") || undefined,
        "data-field": name,
        className: `${fieldInputStyles} ${error ? "border-red-700" : "border-ink-300"}`,
      })}
      {error && (
        <p id={errorId} className="text-sm font-medium text-red-800">
          {error}
        </p>
      )}
    </div>
  );
}
