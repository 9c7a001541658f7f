import { useState, type FormEvent } from "react";
import {
  catalogEntryInputSchema,
  type CatalogEntryInput,
  type CatalogKind,
} from "@shared/machines/catalog.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import type { CatalogEntry } from "@/lib/machine-catalog.ts";

export const kindWords: Record<CatalogKind, string> = {
  builder: "Machine builder",
  control_family: "Control family",
};

const labels = { kind: "Kind", name: "Name", aliases: "Aliases" };

const splitAliases = (text: string) =>
  text
    .split(",")
    .map((a) => a.trim())
    .filter((a) => a.length > 0);

type CatalogEntryFormProps = {
  entry?: CatalogEntry;
  pending: boolean;
  serverError: unknown;
  onSubmit: (input: CatalogEntryInput) => void;
  onCancel?: () => void;
};

/** Adds an entry, or edits one's name and aliases; aliases are typed comma-separated. */
export function CatalogEntryForm({ entry, pending, serverError, onSubmit, onCancel }: CatalogEntryFormProps) {
  const [invalid, setInvalid] = useState<unknown>(null);
  const problem = invalid ?? serverError;
  const fields = fieldErrorsOf(problem);
  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const parsed = catalogEntryInputSchema.safeParse({
      kind: entry?.kind ?? form.get("kind"),
      name: form.get("name"),
      aliases: splitAliases(String(form.get("aliases") ?? "")),
      active: entry?.active ?? true,
    });
    if (!parsed.success) {
      setInvalid(parsed.error);
      return;
    }
    setInvalid(null);
    onSubmit(parsed.data);
    if (!entry) event.currentTarget.reset();
  };
  return (
    <form
      noValidate
      onSubmit={submit}
      className="space-y-3"
      aria-label={entry ? `Edit ${entry.name}` : "Add to the catalog"}
    >
      <FormError error={problem} labels={labels} />
      {!entry && (
        <SelectField
          label={labels.kind}
          name="kind"
          options={[
            { value: "builder", label: kindWords.builder },
            { value: "control_family", label: kindWords.control_family },
          ]}
          defaultValue="builder"
          error={fields.kind}
        />
      )}
      <TextField label={labels.name} name="name" defaultValue={entry?.name} error={fields.name} />
      <TextField
        label={labels.aliases}
        name="aliases"
        defaultValue={entry?.aliases.join(", ")}
        hint="Other spellings people type, separated by commas. Case and spacing never matter."
        error={fields.aliases ?? Object.entries(fields).find(([k]) => k.startsWith("aliases."))?.[1]}
      />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant="secondary" pending={pending} pendingLabel="Saving">
          {entry ? "Save" : "Add"}
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
