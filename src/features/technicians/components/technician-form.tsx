import { useState, type FormEvent } from "react";
import { wholeKmFromMiles, wholeMilesFromKm } from "@shared/geo/units.ts";
import {
  machineTechnologies,
  technicianInputSchema,
  technologyLabels,
  type TechnicianDto as Technician,
  type TechnicianInput,
} from "@shared/technicians/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { centsToInput, inputToCents } from "@/lib/format-money.ts";

const labels = {
  name: "Name",
  email: "E-mail",
  phone: "Phone",
  technologies: "Machine technologies",
  controlFamilies: "Control families",
  postalCode: "Home base ZIP code",
  serviceRadiusKm: "Service radius (miles)",
  hourlyRateCents: "Hourly rate on site ($)",
  travelRateCents: "Travel rate ($ per hour)",
  mileageRateCents: "Mileage rate ($ per mile)",
};

// The shared schema speaks of cents and numbers; people type dollars, so these say it their way.
const plainWords = {
  serviceRadiusKm: "Enter the radius in whole miles",
  hourlyRateCents: "Enter the hourly rate in dollars, e.g. 95.00",
  travelRateCents: "Enter the travel rate in dollars, e.g. 70.00",
  mileageRateCents: "Enter the mileage rate in dollars, e.g. 0.70",
  email: "Enter a valid e-mail address",
};

const textOf = (data: FormData, name: string) => String(data.get(name) ?? "").trim();

/** The form's text as the shared input schema takes it: dollars become integer cents, lists become arrays. */
function toInput(data: FormData): Record<string, unknown> {
  const radius = textOf(data, "serviceRadiusKm");
  const mileage = textOf(data, "mileageRateCents");
  return {
    name: textOf(data, "name"),
    email: textOf(data, "email"),
    phone: textOf(data, "phone") || undefined,
    technologies: data.getAll("technologies").map(String),
    controlFamilies: textOf(data, "controlFamilies")
      .split(",")
      .map((f) => f.trim())
      .filter(Boolean),
    postalCode: textOf(data, "postalCode"),
    // People type miles; the record keeps whole kilometres (shared/geo/units.ts).
    serviceRadiusKm: radius === "" ? Number.NaN : wholeKmFromMiles(Number(radius)),
    hourlyRateCents: inputToCents(textOf(data, "hourlyRateCents")),
    travelRateCents: inputToCents(textOf(data, "travelRateCents")),
    ...(mileage === "" ? {} : { mileageRateCents: inputToCents(mileage) }),
  };
}

type TechnicianFormProps = {
  technician?: Technician | undefined;
  submitLabel: string;
  pending: boolean;
  serverError: unknown;
  onSubmit: (input: TechnicianInput) => void;
};

/** Add or edit a technician; checked with the same schema the server uses. */
export function TechnicianForm({
  technician,
  submitLabel,
  pending,
  serverError,
  onSubmit,
}: TechnicianFormProps) {
  const [invalid, setInvalid] = useState<unknown>(null);
  const problem = invalid ?? serverError;
  const fields = fieldErrorsOf(problem, plainWords);

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = technicianInputSchema.safeParse(toInput(new FormData(event.currentTarget)));
    if (!parsed.success) {
      setInvalid(parsed.error);
      return;
    }
    setInvalid(null);
    onSubmit(parsed.data);
  };

  return (
    <form noValidate onSubmit={submit} className="max-w-3xl space-y-5">
      <FormError error={problem} labels={labels} plainWords={plainWords} />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label={labels.name}
          name="name"
          defaultValue={technician?.name}
          autoComplete="off"
          required
          error={fields.name}
        />
        <TextField
          label={labels.email}
          name="email"
          type="email"
          defaultValue={technician?.email ?? ""}
          autoComplete="off"
          hint="Optional"
          error={fields.email}
        />
        <TextField
          label={labels.phone}
          name="phone"
          type="tel"
          defaultValue={technician?.phone ?? ""}
          hint="Optional"
          error={fields.phone}
        />
        <TextField
          label={labels.postalCode}
          name="postalCode"
          inputMode="numeric"
          maxLength={5}
          defaultValue={technician?.postalCode}
          required
          error={fields.postalCode}
        />
        <TextField
          label={labels.serviceRadiusKm}
          name="serviceRadiusKm"
          type="number"
          min={1}
          max={1240}
          defaultValue={technician ? wholeMilesFromKm(technician.serviceRadiusKm) : undefined}
          required
          error={fields.serviceRadiusKm}
        />
        <TextField
          label={labels.controlFamilies}
          name="controlFamilies"
          defaultValue={technician?.controlFamilies.join(", ")}
          hint="Separate with commas"
          error={fields.controlFamilies}
        />
      </div>
      <fieldset>
        <legend className="mb-2 text-sm font-medium text-ink-900">{labels.technologies}</legend>
        <div className="grid grid-cols-2 gap-2 sm:grid-cols-4">
          {machineTechnologies.map((tech, index) => (
            <label
              key={tech}
              className="flex min-h-11 items-center gap-2 rounded-md border border-ink-200 bg-white px-3 has-checked:border-ink-700 has-focus-visible:outline-2 has-focus-visible:outline-ink-700"
            >
              <input
                type="checkbox"
                name="technologies"
                value={tech}
                defaultChecked={technician?.technologies.includes(tech)}
                data-field={index === 0 ? "technologies" : undefined}
                className="size-4 accent-ink-700"
              />
              <span className="text-sm">{technologyLabels[tech]}</span>
            </label>
          ))}
        </div>
        {fields.technologies && (
          <p className="mt-1 text-sm font-medium text-red-800">{fields.technologies}</p>
        )}
      </fieldset>
      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 text-sm font-medium text-ink-900">Rates</legend>
        <TextField
          label={labels.hourlyRateCents}
          name="hourlyRateCents"
          inputMode="decimal"
          defaultValue={centsToInput(technician?.hourlyRateCents)}
          required
          error={fields.hourlyRateCents}
        />
        <TextField
          label={labels.travelRateCents}
          name="travelRateCents"
          inputMode="decimal"
          defaultValue={centsToInput(technician?.travelRateCents)}
          required
          error={fields.travelRateCents}
        />
        <TextField
          label={labels.mileageRateCents}
          name="mileageRateCents"
          inputMode="decimal"
          defaultValue={centsToInput(technician?.mileageRateCents)}
          hint="Optional"
          error={fields.mileageRateCents}
        />
      </fieldset>
      <Button type="submit" pending={pending} pendingLabel="Saving…">
        {submitLabel}
      </Button>
    </form>
  );
}
