import { SelectField } from "@/components/ui/select-field.tsx";

interface MappedField<K extends string> {
  key: K;
  header: string;
  required: boolean;
}

/** One choice of the file's columns per field an import reads; "Not in this file" leaves the field out. */
export function ColumnMappingFields<K extends string, M extends Partial<Record<K, string>>>({
  fields,
  headers,
  mapping,
  onChange,
}: {
  fields: readonly MappedField<K>[];
  headers: string[];
  mapping: M;
  onChange: (next: M) => void;
}) {
  return (
    <div className="grid gap-3 sm:grid-cols-2">
      {fields.map((field) => (
        <SelectField
          key={field.key}
          label={`${field.header}${field.required ? "" : " (optional)"}`}
          name={`mapping.${field.key}`}
          placeholder="Not in this file"
          options={headers.map((h) => ({ value: h, label: h }))}
          value={mapping[field.key] ?? ""}
          onChange={(e) => {
            const next = { ...mapping };
            if (e.target.value === "") delete next[field.key];
            else next[field.key] = e.target.value as M[K];
            onChange(next);
          }}
        />
      ))}
    </div>
  );
}
