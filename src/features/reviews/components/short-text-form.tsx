import { useId, useState, type FormEvent } from "react";
import type { z } from "zod";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";

type ShortTextFormProps<S extends z.ZodType<{ [k: string]: string }>> = {
  /** The one field's name in the schema ("body", "reason"). */
  name: string;
  label: string;
  submitLabel: string;
  schema: S;
  pending: boolean;
  serverError: unknown;
  onSubmit: (value: z.output<S>) => void;
  onCancel?: () => void;
};

/** A labelled text area and a button, checked with a shared one-field schema (a reply, a report reason). */
export function ShortTextForm<S extends z.ZodType<{ [k: string]: string }>>(props: ShortTextFormProps<S>) {
  const { name, label, submitLabel, schema, pending, serverError, onSubmit, onCancel } = props;
  const id = useId();
  const [invalid, setInvalid] = useState<unknown>(null);
  const problem = invalid ?? serverError;
  const error = fieldErrorsOf(problem)[name];

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = schema.safeParse({ [name]: String(new FormData(event.currentTarget).get(name) ?? "") });
    if (!parsed.success) {
      setInvalid(parsed.error);
      return;
    }
    setInvalid(null);
    onSubmit(parsed.data);
  };

  return (
    <form noValidate onSubmit={submit} className="space-y-2">
      <FormError error={problem} labels={{ [name]: label }} />
      <label htmlFor={id} className="block text-sm font-medium text-ink-900">
        {label}
      </label>
      <textarea
        id={id}
        name={name}
        rows={3}
        data-field={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        className="block w-full rounded-md border border-ink-300 bg-white px-3 py-2 text-base text-ink-900"
      />
      {error && (
        <p id={`${id}-error`} className="text-sm font-medium text-red-800">
          {error}
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant="secondary" pending={pending} pendingLabel="Sending">
          {submitLabel}
        </Button>
        {onCancel && (
          <Button variant="quiet" onClick={onCancel}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}
