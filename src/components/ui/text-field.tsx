import { useId, type InputHTMLAttributes } from "react";

type TextFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, "id"> & {
  label: string;
  name: string;
  /** Shown under the input and announced with it. */
  error?: string | undefined;
  hint?: string;
};

export const fieldInputStyles =
  "block w-full rounded-md border bg-white px-3 py-2 text-base text-ink-900 shadow-sm " +
  "placeholder:text-ink-500 focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-ink-700";

/** A labelled input; the error and hint are tied to it with aria-describedby. */
export function TextField({
  label,
  name,
  error,
  hint,
  className = "",
  type = "text",
  ...rest
}: TextFieldProps) {
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
      <input
        id={id}
        name={name}
        type={type}
        aria-invalid={error ? true : undefined}
        aria-describedby={[hintId, errorId].filter(Boolean).join(" ") || undefined}
        data-field={name}
        className={`${fieldInputStyles} ${error ? "border-red-700" : "border-ink-300"}`}
        {...rest}
      />
      {error && (
        <p id={errorId} className="text-sm font-medium text-red-800">
          {error}
        </p>
      )}
    </div>
  );
}
