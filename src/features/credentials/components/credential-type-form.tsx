import { useState, type FormEvent } from "react";
import { editCredentialTypeSchema } from "@shared/credentials/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { TextAreaField } from "@/components/ui/text-area-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import type { CredentialTypeDto as CredentialType } from "@shared/credentials/credential-shapes.ts";
import { useEditCredentialType } from "../api/edit-credential-type.ts";
import { validityWords } from "./catalogue-table.tsx";

const labels = {
  name: "Name",
  description: "Description",
  active: "In use",
  validityMonths: "Valid for (months from issue)",
};
const plainWords = {
  name: "Enter a name of at least 3 characters",
  description: "Enter a description of at least 3 characters",
};

type CredentialTypeFormProps = { type: CredentialType; onDone: () => void };

/** Edits one catalogue entry; the months only for types that run N months from their issue date. */
export function CredentialTypeForm({ type, onDone }: CredentialTypeFormProps) {
  const [invalid, setInvalid] = useState<unknown>(null);
  const edit = useEditCredentialType();
  const problem = invalid ?? edit.error;
  const fields = fieldErrorsOf(problem, plainWords);
  const months = type.validity.kind === "months_from_issue" ? type.validity.months : null;

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const monthsText = String(data.get("validityMonths") ?? "");
    const parsed = editCredentialTypeSchema.safeParse({
      name: String(data.get("name") ?? ""),
      description: String(data.get("description") ?? ""),
      active: data.get("active") === "on",
      ...(months !== null ? { validityMonths: monthsText === "" ? Number.NaN : Number(monthsText) } : {}),
    });
    if (!parsed.success) {
      setInvalid(parsed.error);
      return;
    }
    setInvalid(null);
    edit.mutate({ code: type.code, ...parsed.data }, { onSuccess: onDone });
  };

  return (
    <form noValidate onSubmit={submit} className="space-y-4" aria-labelledby="edit-type-heading">
      <h2 id="edit-type-heading" className="text-lg font-semibold text-ink-900">
        Edit {type.name}
      </h2>
      <p className="text-sm text-ink-700">
        Code <code className="font-mono">{type.code}</code> · {validityWords(type.validity)}
      </p>
      <FormError error={problem} labels={labels} plainWords={plainWords} />
      <TextField label={labels.name} name="name" defaultValue={type.name} required error={fields.name} />
      <TextAreaField
        label={labels.description}
        name="description"
        defaultValue={type.description}
        rows={4}
        error={fields.description}
      />
      {months !== null && (
        <TextField
          label={labels.validityMonths}
          name="validityMonths"
          type="number"
          min={1}
          max={120}
          defaultValue={months}
          hint="Changes when every card of this type lapses. A site that wants a shorter interval sets a maximum age in its requirement set."
          error={fields.validityMonths}
        />
      )}
      <label className="flex min-h-11 items-center gap-3 text-sm font-medium text-ink-900">
        <input
          type="checkbox"
          name="active"
          defaultChecked={type.active}
          data-field="active"
          className="size-5 accent-ink-700"
        />
        In use (uploaders can choose it)
      </label>
      <div className="flex gap-3">
        <Button type="submit" pending={edit.isPending} pendingLabel="Saving…">
          Save
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
