import { SelectField, type SelectOption } from "@/components/ui/select-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";

export type QueueFilterValues = { typeCode: string; companyId: string; minWaitingHours: string };

type QueueFiltersProps = {
  values: QueueFilterValues;
  typeOptions: readonly SelectOption[];
  companyOptions: readonly SelectOption[];
  onChange: (values: QueueFilterValues) => void;
};

/** Filters the server applies; each change goes to the URL so a filtered queue can be shared or reloaded. */
export function QueueFilters({ values, typeOptions, companyOptions, onChange }: QueueFiltersProps) {
  return (
    <form
      role="search"
      aria-label="Filter the queue"
      onSubmit={(event) => event.preventDefault()}
      className="mb-4 grid gap-3 rounded-lg border border-ink-100 bg-white p-4 sm:grid-cols-3"
    >
      <SelectField
        label="Type"
        name="typeCode"
        value={values.typeCode}
        placeholder="All types"
        options={typeOptions}
        onChange={(event) => onChange({ ...values, typeCode: event.currentTarget.value })}
      />
      <SelectField
        label="Company"
        name="companyId"
        value={values.companyId}
        placeholder="All companies"
        options={companyOptions}
        onChange={(event) => onChange({ ...values, companyId: event.currentTarget.value })}
      />
      <TextField
        label="Waiting at least (hours)"
        name="minWaitingHours"
        type="number"
        min={0}
        inputMode="numeric"
        value={values.minWaitingHours}
        onChange={(event) => onChange({ ...values, minWaitingHours: event.currentTarget.value })}
      />
    </form>
  );
}
