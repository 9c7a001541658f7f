import { useId, useState, type FormEvent } from "react";
import { DEFAULT_RADIUS_MILES } from "@shared/directory/schemas.ts";
import { machineTechnologies, technologyLabels } from "@shared/technicians/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { CatalogCombobox } from "@/components/ui/catalog-combobox.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { SelectField, type SelectOption } from "@/components/ui/select-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import type { DirectoryDraft } from "./directory-draft.ts";

export type MachineChoice = {
  id: number;
  label: string;
  technology: string;
  controlFamily: string;
  builder?: string;
};
export type CredentialTypeChoice = { code: string; name: string };

type DirectoryFiltersProps = {
  draft: DirectoryDraft;
  onChange: (draft: DirectoryDraft) => void;
  /** False when the draft was refused (its errors are shown in the form, which then stays open). */
  onSubmit: () => boolean;
  onClear: () => void;
  sites: readonly SelectOption[];
  machines: readonly MachineChoice[];
  requirementSets: readonly SelectOption[];
  credentialTypes: readonly CredentialTypeChoice[];
  error: unknown;
  /** How many filters the applied search has; shown on the phone's button that opens the filters. */
  activeCount: number;
};

const technologyOptions = machineTechnologies.map((t) => ({ value: t, label: technologyLabels[t] }));
const levelOptions = [
  { value: "1", label: "1 · operator" },
  { value: "2", label: "2 · maintenance" },
  { value: "3", label: "3 · advanced service" },
];
const ratingOptions = ["4.5", "4", "3.5", "3"].map((v) => ({ value: v, label: `${v} stars or more` }));

const labels = {
  siteId: "Site",
  radiusMiles: "Radius (miles)",
  equipmentId: "Machine",
  technology: "Technology",
  credentialTypes: "Credential types",
  requirementSetId: "Requirement set",
  minRating: "Minimum rating",
  q: "Name of technician or company",
  onSiteHours: "Expected hours on site",
  oemBuilder: "Machine builder",
  controlFamily: "Control family",
  minOemLevel: "Minimum OEM level",
  minEachOccurrence: "General liability, each occurrence at least ($)",
  minAggregate: "General liability, aggregate at least ($)",
  minAutoCsl: "Auto liability, combined single limit at least ($)",
};

/** The directory's filters. The page keeps them in the URL; this form edits a draft and applies it on submit. */
export function DirectoryFilters(props: DirectoryFiltersProps) {
  const {
    draft,
    onChange,
    onSubmit,
    onClear,
    sites,
    machines,
    requirementSets,
    credentialTypes,
    error,
    activeCount,
  } = props;
  // On a phone the filters would push the first result two screens down: they fold behind a button.
  const [open, setOpen] = useState(false);
  const panelId = useId();
  const errors = fieldErrorsOf(error);
  const set = (patch: Partial<DirectoryDraft>) => onChange({ ...draft, ...patch });
  const text = (
    name: keyof typeof labels & keyof DirectoryDraft,
    extra: { inputMode?: "numeric" | "decimal"; hint?: string } = {},
  ) => (
    <TextField
      label={labels[name]}
      name={name}
      value={draft[name] as string}
      onChange={(e) => set({ [name]: e.target.value })}
      error={errors[name]}
      {...extra}
    />
  );
  const pickMachine = (equipmentId: string) => {
    const machine = machines.find((m) => String(m.id) === equipmentId);
    // Picking a machine fills the technology, control family and builder (the search matches the builder too).
    set(
      machine
        ? {
            equipmentId,
            technology: machine.technology,
            controlFamily: machine.controlFamily,
            oemBuilder: machine.builder ?? "",
          }
        : { equipmentId },
    );
  };
  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    if (onSubmit()) setOpen(false);
  };
  const activeWords =
    activeCount === 0 ? "none set" : `${activeCount} ${activeCount === 1 ? "filter" : "filters"} set`;

  return (
    <div className="space-y-3">
      <Button
        variant="secondary"
        className="w-full justify-between md:hidden"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((o) => !o)}
      >
        <span>{open ? "Hide filters" : "Show filters"}</span>
        <span className="rounded-full bg-ink-100 px-2 py-0.5 text-sm font-normal text-ink-900">
          {activeWords}
        </span>
      </Button>
      <form
        id={panelId}
        noValidate
        onSubmit={submit}
        role="search"
        aria-label="Directory filters"
        className={`${open ? "block" : "hidden"} space-y-4 rounded-lg border border-ink-100 bg-white p-4 md:block`}
      >
        <FormError error={error} labels={labels} />
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
          <SelectField
            label={labels.siteId}
            name="siteId"
            options={sites}
            placeholder="Any location"
            value={draft.siteId}
            onChange={(e) => set({ siteId: e.target.value, equipmentId: "" })}
            error={errors.siteId}
          />
          {text("radiusMiles", {
            inputMode: "numeric",
            hint: `With a site; ${DEFAULT_RADIUS_MILES} miles if left empty`,
          })}
          <SelectField
            label={labels.equipmentId}
            name="equipmentId"
            options={machines.map((m) => ({ value: String(m.id), label: m.label }))}
            placeholder={draft.siteId ? "Any machine" : "Choose a site first"}
            disabled={!draft.siteId || machines.length === 0}
            value={draft.equipmentId}
            onChange={(e) => pickMachine(e.target.value)}
            hint="Fills technology, control family and builder"
            error={errors.equipmentId}
          />
          <SelectField
            label={labels.technology}
            name="technology"
            options={technologyOptions}
            placeholder="Any technology"
            value={draft.technology}
            onChange={(e) => set({ technology: e.target.value })}
            error={errors.technology}
          />
          <CatalogCombobox
            kind="control_family"
            label={labels.controlFamily}
            name="controlFamily"
            value={draft.controlFamily}
            onChange={(controlFamily) => set({ controlFamily })}
            error={errors.controlFamily}
          />
          <SelectField
            label={labels.requirementSetId}
            name="requirementSetId"
            options={requirementSets}
            placeholder="Platform baseline only"
            value={draft.requirementSetId}
            onChange={(e) => set({ requirementSetId: e.target.value })}
            error={errors.requirementSetId}
          />
          <SelectField
            label={labels.minRating}
            name="minRating"
            options={ratingOptions}
            placeholder="Any rating"
            value={draft.minRating}
            onChange={(e) => set({ minRating: e.target.value })}
            error={errors.minRating}
          />
          {text("q")}
        </div>
        <fieldset>
          <legend className="mb-1 text-sm font-medium text-ink-900">
            {labels.credentialTypes} (holds all that are ticked)
          </legend>
          <div className="grid gap-x-3 sm:grid-cols-2 lg:grid-cols-4">
            {credentialTypes.map((type, i) => (
              <label key={type.code} className="flex min-h-11 items-center gap-2 text-sm text-ink-900">
                <input
                  type="checkbox"
                  name="credentialTypes"
                  value={type.code}
                  data-field={i === 0 ? "credentialTypes" : undefined}
                  className="size-4 accent-ink-700"
                  checked={draft.credentialTypes.includes(type.code)}
                  onChange={(e) =>
                    set({
                      credentialTypes: e.target.checked
                        ? [...draft.credentialTypes, type.code]
                        : draft.credentialTypes.filter((c) => c !== type.code),
                    })
                  }
                />
                {type.name}
              </label>
            ))}
          </div>
        </fieldset>
        <details
          open={
            Boolean(
              draft.oemBuilder ||
              draft.minOemLevel ||
              draft.minEachOccurrence ||
              draft.minAggregate ||
              draft.minAutoCsl,
            ) || undefined
          }
        >
          <summary className="min-h-11 cursor-pointer py-2 text-sm font-semibold text-ink-900">
            Machine builder training, insurance limits and estimate
          </summary>
          <div className="grid gap-4 pt-2 sm:grid-cols-2 lg:grid-cols-4">
            <CatalogCombobox
              kind="builder"
              label={labels.oemBuilder}
              name="oemBuilder"
              value={draft.oemBuilder}
              onChange={(oemBuilder) => set({ oemBuilder })}
              error={errors.oemBuilder}
              hint="Any spelling the catalog knows, e.g. a short name"
            />
            <SelectField
              label={labels.minOemLevel}
              name="minOemLevel"
              options={levelOptions}
              placeholder="Any level"
              value={draft.minOemLevel}
              onChange={(e) => set({ minOemLevel: e.target.value })}
              error={errors.minOemLevel}
            />
            {text("minEachOccurrence", { inputMode: "numeric" })}
            {text("minAggregate", { inputMode: "numeric" })}
            {text("minAutoCsl", { inputMode: "numeric" })}
            {text("onSiteHours", {
              inputMode: "decimal",
              hint: "For the service call estimate; 2 if left empty",
            })}
          </div>
        </details>
        <div className="flex flex-wrap gap-2">
          <Button type="submit">Search</Button>
          <Button variant="quiet" onClick={onClear}>
            Clear filters
          </Button>
        </div>
      </form>
    </div>
  );
}
