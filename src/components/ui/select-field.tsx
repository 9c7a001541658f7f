import type { SelectHTMLAttributes } from "react";
import { Field } from "./field.tsx";

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
  className,
  ...rest
}: SelectFieldProps) {
  return (
    <Field label={label} name={name} error={error} hint={hint} className={className}>
      {(control) => (
        <select {...control} {...rest}>
          {placeholder !== undefined && <option value="">{placeholder}</option>}
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      )}
    </Field>
  );
}
