import { Button } from "@/components/ui/button.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import type { FieldErrors } from "@/lib/field-errors.ts";
import { offeredLimits, type RequirementDraft } from "./requirement-draft.ts";

export type CredentialTypeChoice = { code: string; name: string };

type RequirementFieldsProps = {
  index: number;
  draft: RequirementDraft;
  credentialTypes: readonly CredentialTypeChoice[];
  errors: FieldErrors;
  onChange: (draft: RequirementDraft) => void;
  onRemove?: (() => void) | undefined;
  /** A shop's set names the shop; the platform baseline asks for the endorsement without naming anyone. */
  additionalInsuredLabel: string;
  /**
   * Whether a stored minimum on a line the form does not offer opens the insurance section. The baseline opens it;
   * a shop's set keeps it closed as it always has.
   */
  opensForUnlistedLimits?: boolean | undefined;
};

const levelOptions = [
  { value: "1", label: "1 · operator" },
  { value: "2", label: "2 · maintenance" },
  { value: "3", label: "3 · advanced service" },
];

const checkboxRow = "flex min-h-11 items-center gap-2 rounded px-1 text-sm text-ink-900 hover:bg-ink-50";

/** One requirement line; inputs are named by their path ("requirements.0.label") so the error summary links to them. */
export function RequirementFields({
  index,
  draft,
  credentialTypes,
  errors,
  onChange,
  onRemove,
  additionalInsuredLabel,
  opensForUnlistedLimits = false,
}: RequirementFieldsProps) {
  const path = (field: string) => `requirements.${index}.${field}`;
  const set = (patch: Partial<RequirementDraft>) => onChange({ ...draft, ...patch });
  const typesError = errors[path("typeCodes")];
  const hasInsurance =
    Object.values(draft.limits).some(Boolean) ||
    (opensForUnlistedLimits && Object.keys(draft.otherLimits).length > 0) ||
    draft.additionalInsured ||
    draft.waiverOfSubrogation ||
    draft.statutory;
  const additionalInsuredError = errors[path("additionalInsured")];
  const statutoryError = errors[path("statutory")];
  const hasTraining = Boolean(draft.maxAgeMonths || draft.builder || draft.controlFamily || draft.minLevel);
  return (
    <fieldset className="space-y-4 rounded-lg border border-ink-100 bg-white p-4">
      <legend className="px-1 font-semibold text-ink-900">Requirement {index + 1}</legend>
      <TextField
        label="What it is called"
        name={path("label")}
        value={draft.label}
        onChange={(e) => set({ label: e.target.value })}
        error={errors[path("label")]}
      />
      <fieldset aria-describedby={typesError ? `${path("typeCodes")}-error` : undefined}>
        <legend className="mb-1 text-sm font-medium text-ink-900">
          Credential types (any one of them meets it)
        </legend>
        <div className="grid gap-1 sm:grid-cols-2 lg:grid-cols-3">
          {credentialTypes.map((type, i) => (
            <label key={type.code} className={checkboxRow}>
              <input
                type="checkbox"
                className="size-4 accent-ink-700"
                data-field={i === 0 ? path("typeCodes") : undefined}
                checked={draft.typeCodes.includes(type.code)}
                onChange={(e) =>
                  set({
                    typeCodes: e.target.checked
                      ? [...draft.typeCodes, type.code]
                      : draft.typeCodes.filter((c) => c !== type.code),
                  })
                }
              />
              {type.name}
            </label>
          ))}
        </div>
        {typesError && (
          <p id={`${path("typeCodes")}-error`} className="mt-1 text-sm font-medium text-red-800">
            {typesError}
          </p>
        )}
      </fieldset>
      <details open={hasInsurance || undefined}>
        <summary className="min-h-11 cursor-pointer py-2 text-sm font-semibold text-ink-900">
          Insurance: minimum limits and endorsements
        </summary>
        <div className="grid gap-3 pt-2 sm:grid-cols-2 lg:grid-cols-3">
          {offeredLimits.map(([name, label]) => (
            <TextField
              key={name}
              label={label}
              name={path(`minLimits.${name}`)}
              inputMode="numeric"
              value={draft.limits[name] ?? ""}
              onChange={(e) => set({ limits: { ...draft.limits, [name]: e.target.value } })}
              error={errors[path(`minLimits.${name}`)]}
            />
          ))}
        </div>
        <div className="mt-3 flex flex-wrap gap-4">
          <label className={checkboxRow}>
            <input
              type="checkbox"
              className="size-4 accent-ink-700"
              name={path("additionalInsured")}
              data-field={path("additionalInsured")}
              aria-invalid={additionalInsuredError ? true : undefined}
              aria-describedby={additionalInsuredError ? `${path("additionalInsured")}-error` : undefined}
              checked={draft.additionalInsured}
              onChange={(e) => set({ additionalInsured: e.target.checked })}
            />
            {additionalInsuredLabel}
          </label>
          <label className={checkboxRow}>
            <input
              type="checkbox"
              className="size-4 accent-ink-700"
              name={path("statutory")}
              data-field={path("statutory")}
              aria-invalid={statutoryError ? true : undefined}
              aria-describedby={statutoryError ? `${path("statutory")}-error` : undefined}
              checked={draft.statutory}
              onChange={(e) => set({ statutory: e.target.checked })}
            />
            Workers' compensation: statutory limits (per statute)
          </label>
          <label className={checkboxRow}>
            <input
              type="checkbox"
              className="size-4 accent-ink-700"
              checked={draft.waiverOfSubrogation}
              onChange={(e) => set({ waiverOfSubrogation: e.target.checked })}
            />
            Waiver of subrogation
          </label>
        </div>
        {additionalInsuredError && (
          <p id={`${path("additionalInsured")}-error`} className="mt-1 text-sm font-medium text-red-800">
            {additionalInsuredError}
          </p>
        )}
        {statutoryError && (
          <p id={`${path("statutory")}-error`} className="mt-1 text-sm font-medium text-red-800">
            {statutoryError}
          </p>
        )}
      </details>
      <details open={hasTraining || undefined}>
        <summary className="min-h-11 cursor-pointer py-2 text-sm font-semibold text-ink-900">
          Training: age and machine-builder (OEM) details
        </summary>
        <div className="grid gap-3 pt-2 sm:grid-cols-2 lg:grid-cols-4">
          <TextField
            label="Card no older than (months)"
            name={path("maxAgeMonths")}
            inputMode="numeric"
            hint="For a card without a printed expiry this replaces the catalog's interval."
            value={draft.maxAgeMonths}
            onChange={(e) => set({ maxAgeMonths: e.target.value })}
            error={errors[path("maxAgeMonths")]}
          />
          <TextField
            label="OEM builder"
            name={path("builder")}
            value={draft.builder}
            onChange={(e) => set({ builder: e.target.value })}
            error={errors[path("builder")]}
          />
          <TextField
            label="OEM control family"
            name={path("controlFamily")}
            value={draft.controlFamily}
            onChange={(e) => set({ controlFamily: e.target.value })}
            error={errors[path("controlFamily")]}
          />
          <SelectField
            label="Minimum OEM level"
            name={path("minLevel")}
            options={levelOptions}
            placeholder="Any level"
            value={draft.minLevel}
            onChange={(e) => set({ minLevel: e.target.value })}
            error={errors[path("minLevel")]}
          />
        </div>
      </details>
      {onRemove && (
        <Button variant="danger" onClick={onRemove}>
          Remove requirement {index + 1}
        </Button>
      )}
    </fieldset>
  );
}
