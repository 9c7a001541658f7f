import type { FormEvent } from "react";
import { machineStates } from "@shared/sites/schemas.ts";
import { machineTechnologies, technologyLabels } from "@shared/technicians/schemas.ts";
import { machineStateLabels } from "@shared/machines/machine-states.ts";
import { Button } from "@/components/ui/button.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { readForm } from "@/lib/read-form.ts";
import type { MachineFilters as Filters } from "../api/machine-keys.ts";
import { useBuilderCatalog } from "../api/get-builder-catalog.ts";

type MachineFiltersProps = {
  sites: { id: number; name: string }[];
  filters: Filters;
  onChange: (filters: Filters) => void;
};

const technologyOptions = machineTechnologies.map((t) => ({ value: t, label: technologyLabels[t] }));
const stateOptions = machineStates.map((s) => ({ value: s, label: machineStateLabels[s] }));

/** Site, technology and state apply at once; the builder (any catalog name or alias) on "Apply". */
export function MachineFilters({ sites, filters, onChange }: MachineFiltersProps) {
  const builders = useBuilderCatalog();
  const apply = (form: HTMLFormElement) => {
    const v = readForm(form);
    onChange({
      siteId: v.siteId ? Number(v.siteId) : undefined,
      builder: v.builder?.trim() || undefined,
      technology: v.technology || undefined,
      state: v.state || undefined,
    });
  };
  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    apply(event.currentTarget);
  };
  return (
    <form
      aria-label="Filter machines"
      onSubmit={submit}
      onChange={(e) => {
        if ((e.target as HTMLElement).tagName === "SELECT") apply(e.currentTarget);
      }}
      className="mb-4 grid gap-3 sm:grid-cols-2 lg:grid-cols-[repeat(4,minmax(0,1fr))_auto] lg:items-end"
    >
      <SelectField
        label="Site"
        name="siteId"
        placeholder="Every site"
        options={sites.map((s) => ({ value: String(s.id), label: s.name }))}
        defaultValue={filters.siteId ? String(filters.siteId) : ""}
      />
      <TextField
        label="Builder"
        name="builder"
        list="machine-builders"
        autoComplete="off"
        defaultValue={filters.builder ?? ""}
      />
      <datalist id="machine-builders">
        {(builders.data ?? [])
          .filter((b) => b.active)
          .map((b) => (
            <option key={b.id} value={b.name} />
          ))}
      </datalist>
      <SelectField
        label="Technology"
        name="technology"
        placeholder="Every technology"
        options={technologyOptions}
        defaultValue={filters.technology ?? ""}
      />
      <SelectField
        label="State"
        name="state"
        placeholder="Every state"
        options={stateOptions}
        defaultValue={filters.state ?? ""}
      />
      <div>
        <Button type="submit" variant="secondary">
          Apply
        </Button>
      </div>
    </form>
  );
}
