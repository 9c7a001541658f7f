import type { InputHTMLAttributes } from "react";
import { Field } from "./field.tsx";

type TextFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, "id"> & {
  label: string;
  name: string;
  /** Shown under the input and announced with it. */
  error?: string | undefined;
  hint?: string;
};

/** A labelled input; the error and hint are tied to it with aria-describedby. */
export function TextField({ label, name, error, hint, className, type = "text", ...rest }: TextFieldProps) {
  return (
    <Field label={label} name={name} error={error} hint={hint} className={className}>
      {(control) => <input {...control} type={type} {...rest} />}
    </Field>
  );
}
