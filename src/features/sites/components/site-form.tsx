import { useState, type FormEvent } from "react";
import { siteInputSchema, type SiteDto as Site, type SiteInput } from "@shared/sites/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { SelectField, type SelectOption } from "@/components/ui/select-field.tsx";
import { TextAreaField } from "@/components/ui/text-area-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { readForm } from "@/lib/read-form.ts";
import { centsToInput, inputToCents } from "@/lib/format-money.ts";
import { usePostalPlace } from "../api/look-up-postal-code.ts";

const labels = {
  name: "Site name",
  addressLine: "Street address",
  postalCode: "ZIP code",
  timeZone: "Time zone",
  contactName: "On-site contact",
  contactPhone: "Contact's phone",
  safetyInductionNote: "Site safety induction",
  defaultPoNumber: "PO number for new work orders",
  defaultNotToExceedCents: "Not to exceed for new work orders (dollars)",
};

type SiteFormProps = {
  site?: Site | undefined;
  timeZoneOptions: readonly SelectOption[];
  pending: boolean;
  serverError: unknown;
  onSubmit: (input: SiteInput) => void;
  onCancel?: () => void;
};

/** Add or edit a site. The ZIP code is looked up as it is typed: the city shows and the time zone is suggested. */
export function SiteForm({ site, timeZoneOptions, pending, serverError, onSubmit, onCancel }: SiteFormProps) {
  const [invalid, setInvalid] = useState<unknown>(null);
  const [postalCode, setPostalCode] = useState(site?.postalCode ?? "");
  const [timeZone, setTimeZone] = useState(site?.timeZone ?? "");
  const [zoneTouched, setZoneTouched] = useState(Boolean(site));
  const place = usePostalPlace(postalCode);
  const suggested = place.data?.timeZone ?? "";
  const shownZone = zoneTouched ? timeZone : suggested || timeZone;
  const problem = invalid ?? serverError;
  const fields = fieldErrorsOf(problem);
  const options =
    timeZoneOptions.some((o) => o.value === shownZone) || !shownZone
      ? timeZoneOptions
      : [...timeZoneOptions, { value: shownZone, label: shownZone }];

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const { defaultNotToExceed, ...values } = readForm(event.currentTarget);
    const parsed = siteInputSchema.safeParse({
      ...values,
      timeZone: values.timeZone || undefined,
      defaultNotToExceedCents: defaultNotToExceed ? inputToCents(String(defaultNotToExceed)) : null,
    });
    if (!parsed.success) {
      setInvalid(parsed.error);
      return;
    }
    setInvalid(null);
    onSubmit(parsed.data);
  };

  return (
    <form
      noValidate
      onSubmit={submit}
      className="space-y-4"
      aria-label={site ? `Edit ${site.name}` : "Add a site"}
    >
      <FormError error={problem} labels={labels} />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label={labels.name} name="name" defaultValue={site?.name} required error={fields.name} />
        <TextField
          label={labels.addressLine}
          name="addressLine"
          defaultValue={site?.addressLine}
          autoComplete="street-address"
          required
          error={fields.addressLine}
        />
        <div>
          <TextField
            label={labels.postalCode}
            name="postalCode"
            inputMode="numeric"
            autoComplete="postal-code"
            maxLength={5}
            value={postalCode}
            onChange={(e) => setPostalCode(e.target.value.trim())}
            required
            error={fields.postalCode ?? (place.isError ? "We do not know this ZIP code" : undefined)}
          />
          <p className="mt-1 min-h-5 text-sm text-ink-700" aria-live="polite">
            {place.data ? `${place.data.city}, ${place.data.state}` : place.isFetching ? "Looking up…" : ""}
          </p>
        </div>
        <SelectField
          label={labels.timeZone}
          name="timeZone"
          options={options}
          placeholder="Suggest from the ZIP code"
          value={shownZone}
          onChange={(e) => {
            setZoneTouched(true);
            setTimeZone(e.target.value);
          }}
          hint={suggested ? `Suggested for this ZIP code: ${suggested}` : undefined}
          error={fields.timeZone}
        />
        <TextField
          label={labels.contactName}
          name="contactName"
          defaultValue={site?.contactName ?? ""}
          hint="Optional; new work orders start from it"
          error={fields.contactName}
        />
        <TextField
          label={labels.contactPhone}
          name="contactPhone"
          type="tel"
          autoComplete="tel"
          defaultValue={site?.contactPhone ?? ""}
          hint="Optional"
          error={fields.contactPhone}
        />
        <TextField
          label={labels.defaultPoNumber}
          name="defaultPoNumber"
          defaultValue={site?.defaultPoNumber ?? ""}
          hint="Optional"
          error={fields.defaultPoNumber}
        />
        <TextField
          label={labels.defaultNotToExceedCents}
          name="defaultNotToExceed"
          inputMode="decimal"
          defaultValue={centsToInput(site?.defaultNotToExceedCents)}
          hint="Optional"
          error={fields.defaultNotToExceedCents}
        />
      </div>
      <TextAreaField
        label={labels.safetyInductionNote}
        name="safetyInductionNote"
        rows={2}
        defaultValue={site?.safetyInductionNote ?? ""}
        hint="Optional: what a visiting technician must do before work (gate, induction, PPE). Sent only once a job is accepted."
        error={fields.safetyInductionNote}
      />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" pending={pending} pendingLabel="Saving">
          {site ? "Save site" : "Add site"}
        </Button>
        {onCancel && (
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}
