import { useId } from "react";
import { CatalogComboboxInput } from "@/components/ui/catalog-combobox.tsx";
import { fieldInputStyles } from "@/components/ui/field-styles.ts";
import type { FieldDefinition } from "./field-definitions.ts";
import { ReadMarker } from "./read-marker.tsx";

type CredentialFieldInputProps = {
  definition: FieldDefinition;
  value: string | boolean;
  onChange: (value: string | boolean) => void;
  error?: string | undefined;
  wasRead: boolean;
  /** Read from the document but with low confidence: marked for a closer look. */
  lowConfidence?: boolean | undefined;
  disabled?: boolean | undefined;
};

/** One labelled input of a credential's fields, with its marker, hint and error tied to it for screen readers. */
export function CredentialFieldInput({
  definition,
  value,
  onChange,
  error,
  wasRead,
  lowConfidence,
  disabled,
}: CredentialFieldInputProps) {
  const id = `credential-${definition.path.replace(/\W/g, "-")}-${useId()}`;
  const markerId = wasRead ? `${id}-read` : undefined;
  const doubtId = lowConfidence ? `${id}-doubt` : undefined;
  const doubt = doubtId && (
    <p id={doubtId} className="text-sm font-medium text-amber-900">
      Low confidence: compare it with the document closely.
    </p>
  );
  const hintId = definition.hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [markerId, doubtId, hintId, errorId].filter(Boolean).join(" ") || undefined;
  const border = error ? "border-red-700" : wasRead ? "border-ink-500 border-dashed" : "border-ink-300";

  if (definition.kind === "checkbox") {
    return (
      <div className="space-y-1">
        <label className="flex min-h-11 cursor-pointer items-center gap-3 rounded-md border border-ink-200 bg-white px-3 py-2 has-focus-visible:outline-2 has-focus-visible:outline-ink-700">
          <input
            id={id}
            type="checkbox"
            checked={value === true}
            onChange={(event) => onChange(event.currentTarget.checked)}
            disabled={disabled}
            aria-describedby={describedBy}
            data-field={definition.path}
            className="size-5 accent-ink-700"
          />
          <span className="text-sm font-medium text-ink-900">{definition.label}</span>
        </label>
        {markerId && <ReadMarker id={markerId} />}
        {doubt}
        {error && (
          <p id={errorId} className="text-sm font-medium text-red-800">
            {error}
          </p>
        )}
      </div>
    );
  }

  const common = {
    id,
    name: definition.path,
    disabled,
    required: definition.required,
    "aria-invalid": error ? true : undefined,
    "aria-describedby": describedBy,
    "data-field": definition.path,
    className: `${fieldInputStyles} ${border}`,
  } as const;
  const text = typeof value === "string" ? value : "";

  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium text-ink-900">
        {definition.label}
        {!definition.required && <span className="font-normal text-ink-700"> (optional)</span>}
      </label>
      {markerId && <ReadMarker id={markerId} />}
      {doubt}
      {definition.hint && (
        <p id={hintId} className="text-sm text-ink-700">
          {definition.hint}
        </p>
      )}
      {definition.catalog ? (
        <CatalogComboboxInput kind={definition.catalog} control={common} value={text} onChange={onChange} />
      ) : definition.kind === "level" ? (
        <select {...common} value={text} onChange={(event) => onChange(event.currentTarget.value)}>
          <option value="">Choose a level</option>
          <option value="1">1 — operator</option>
          <option value="2">2 — maintenance</option>
          <option value="3">3 — advanced service</option>
        </select>
      ) : (
        <input
          {...common}
          type={definition.kind === "date" ? "date" : "text"}
          inputMode={definition.kind === "dollars" ? "numeric" : undefined}
          maxLength={definition.kind === "state" ? 2 : undefined}
          autoComplete="off"
          value={text}
          onChange={(event) => onChange(event.currentTarget.value)}
        />
      )}
      {error && (
        <p id={errorId} className="text-sm font-medium text-red-800">
          {error}
        </p>
      )}
    </div>
  );
}
