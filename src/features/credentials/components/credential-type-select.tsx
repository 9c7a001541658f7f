import { useId } from "react";
import type { CredentialCategory } from "@shared/credentials/catalogue.ts";
import { fieldInputStyles } from "@/components/ui/field-styles.ts";
import type { CredentialTypeDto as CredentialType } from "@shared/credentials/credential-shapes.ts";

export const categoryLabels: Record<CredentialCategory, string> = {
  insurance: "Insurance",
  safety: "Safety training",
  oem: "Machine builder (OEM) training",
  license: "Licenses",
};

type CredentialTypeSelectProps = {
  types: readonly CredentialType[];
  value: string;
  onChange: (code: string) => void;
  error?: string | undefined;
  disabled?: boolean;
};

/** The credential types grouped by category, as people look for them. */
export function CredentialTypeSelect({ types, value, onChange, error, disabled }: CredentialTypeSelectProps) {
  const id = useId();
  const errorId = error ? `${id}-error` : undefined;
  const chosen = types.find((t) => t.code === value);
  const groups = (Object.keys(categoryLabels) as CredentialCategory[])
    .map((category) => ({ category, types: types.filter((t) => t.category === category) }))
    .filter((group) => group.types.length > 0);
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium text-ink-900">
        Type of document
      </label>
      <select
        id={id}
        value={value}
        disabled={disabled}
        onChange={(event) => onChange(event.currentTarget.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={errorId}
        data-field="typeCode"
        className={`${fieldInputStyles} min-h-12 ${error ? "border-red-700" : "border-ink-300"}`}
      >
        <option value="">Choose a type</option>
        {groups.map((group) => (
          <optgroup key={group.category} label={categoryLabels[group.category]}>
            {group.types.map((type) => (
              <option key={type.code} value={type.code}>
                {type.name}
              </option>
            ))}
          </optgroup>
        ))}
      </select>
      {chosen && <p className="text-sm text-ink-700">{chosen.description}</p>}
      {error && (
        <p id={errorId} className="text-sm font-medium text-red-800">
          {error}
        </p>
      )}
    </div>
  );
}
