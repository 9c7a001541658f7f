import type { TextareaHTMLAttributes } from "react";
import { Field } from "./field.tsx";

type TextAreaFieldProps = Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, "id"> & {
  label: string;
  name: string;
  /** Shown under the text area and announced with it. */
  error?: string | undefined;
  hint?: string;
};

/** A labelled text area for a few lines of free text; the error and hint are tied to it with aria-describedby. */
export function TextAreaField({ label, name, error, hint, className, ...rest }: TextAreaFieldProps) {
  return (
    <Field label={label} name={name} error={error} hint={hint} className={className}>
      {(control) => <textarea {...control} {...rest} />}
    </Field>
  );
}
