import type { FieldDefinition } from "./field-definitions.ts";
import type { FieldValues } from "./field-values.ts";
import { CredentialFieldInput } from "./credential-field-input.tsx";

type CredentialFieldsFormProps = {
  definitions: readonly FieldDefinition[];
  values: FieldValues;
  onChange: (path: string, value: string | boolean) => void;
  /** Messages by field path ("limits.eachOccurrence"). */
  errors: Readonly<Record<string, string>>;
  /** Paths the server read from the document. */
  found: ReadonlySet<string>;
  /** Paths read with low confidence, marked for a closer look. */
  lowConfidence?: ReadonlySet<string>;
  /** Told which field has the focus, so the document beside it can show where that value was read. */
  onFocusField?: (path: string) => void;
  disabled?: boolean;
};

/** Every input of a type's field set; limits and flags get their own group so the form reads like the certificate. */
export function CredentialFieldsForm({
  definitions,
  values,
  onChange,
  errors,
  found,
  lowConfidence,
  onFocusField,
  disabled,
}: CredentialFieldsFormProps) {
  const limits = definitions.filter((d) => d.kind === "dollars" || d.path === "statutory");
  const flags = definitions.filter((d) => d.kind === "checkbox" && d.path !== "statutory");
  const main = definitions.filter((d) => !limits.includes(d) && !flags.includes(d));
  const input = (definition: FieldDefinition) => (
    <div key={definition.path} onFocus={onFocusField ? () => onFocusField(definition.path) : undefined}>
      <CredentialFieldInput
        definition={definition}
        value={values[definition.path] ?? ""}
        onChange={(value) => onChange(definition.path, value)}
        error={errors[definition.path]}
        wasRead={found.has(definition.path)}
        lowConfidence={lowConfidence?.has(definition.path)}
        disabled={disabled}
      />
    </div>
  );
  return (
    <div className="space-y-5">
      <div className="grid gap-4 sm:grid-cols-2">{main.map(input)}</div>
      {limits.length > 0 && (
        <fieldset className="rounded-md border border-ink-100 p-4">
          <legend className="px-1 text-sm font-semibold text-ink-900">Limits</legend>
          <div className="grid gap-4 sm:grid-cols-2">{limits.map(input)}</div>
        </fieldset>
      )}
      {flags.length > 0 && (
        <fieldset className="space-y-2">
          <legend className="mb-1 text-sm font-semibold text-ink-900">Marks on the certificate</legend>
          {flags.map(input)}
        </fieldset>
      )}
    </div>
  );
}
