import { useState, type FormEvent } from "react";
import type { EstimateRevisionDto } from "@shared/service-requests/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { TextAreaField } from "@/components/ui/text-area-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import type { EstimateFormInput } from "../api/answer-service-request.ts";

type Technician = {
  id: number;
  name: string;
  hourlyRateCents: number;
  travelRateCents: number;
  mileageRateCents: number;
};

type Props = {
  technicians: Technician[];
  current: EstimateRevisionDto | null;
  timeZone: string;
  pending: boolean;
  error: unknown;
  submitLabel: string;
  onSubmit: (input: EstimateFormInput) => void;
};

const dollars = (cents: number) => (cents / 100).toFixed(2);
const toCents = (text: string) => Math.round(Number(text) * 100);
const localOf = (iso: string, zone: string) => {
  const parts = new Intl.DateTimeFormat("en-CA", {
    timeZone: zone,
    year: "numeric",
    month: "2-digit",
    day: "2-digit",
    hour: "2-digit",
    minute: "2-digit",
    hourCycle: "h23",
  }).formatToParts(new Date(iso));
  const get = (type: string) => parts.find((p) => p.type === type)?.value ?? "";
  return `${get("year")}-${get("month")}-${get("day")}T${get("hour")}:${get("minute")}`;
};
const labels = {
  technicianId: "Technician",
  hourlyRateCents: "Hourly rate",
  earliestArrival: "Earliest arrival",
  validUntil: "Valid until",
  onSiteHours: "Hours on site",
};

/** One column, large fields: usable on a 390 px phone in the truck. */
export function EstimateForm({
  technicians,
  current,
  timeZone,
  pending,
  error,
  submitLabel,
  onSubmit,
}: Props) {
  const first = technicians[0];
  const [form, setForm] = useState({
    technicianId: String(current?.technicianId ?? first?.id ?? ""),
    hourly: dollars(current?.hourlyRateCents ?? first?.hourlyRateCents ?? 0),
    travel: dollars(current?.travelRateCents ?? first?.travelRateCents ?? 0),
    mileage: dollars(current?.mileageRateCents ?? first?.mileageRateCents ?? 0),
    hours: String(current?.onSiteHours ?? 2),
    arrival: current ? localOf(current.earliestArrival, timeZone) : "",
    validUntil: current?.validUntil ?? "",
    note: current?.note ?? "",
    partName: current?.parts[0]?.description ?? "",
    partPrice: current?.parts[0]?.unitPriceCents != null ? dollars(current.parts[0].unitPriceCents) : "",
  });
  const set = (name: keyof typeof form) => (e: { target: { value: string } }) =>
    setForm((f) => ({ ...f, [name]: e.target.value }));
  const errors = fieldErrorsOf(error);
  function submit(e: FormEvent) {
    e.preventDefault();
    onSubmit({
      technicianId: Number(form.technicianId),
      hourlyRateCents: toCents(form.hourly),
      travelRateCents: toCents(form.travel),
      mileageRateCents: toCents(form.mileage),
      onSiteHours: Number(form.hours),
      earliestArrival: form.arrival,
      parts: form.partName
        ? [
            {
              description: form.partName,
              quantity: 1,
              unitPriceCents: form.partPrice ? toCents(form.partPrice) : null,
            },
          ]
        : [],
      ...(form.note ? { note: form.note } : {}),
      validUntil: form.validUntil,
    });
  }
  return (
    <form onSubmit={submit} className="space-y-3" noValidate aria-label="Estimate">
      <FormError error={error} labels={labels} />
      <SelectField
        label="Technician"
        name="technicianId"
        value={form.technicianId}
        onChange={set("technicianId")}
        options={technicians.map((t) => ({ value: String(t.id), label: t.name }))}
        error={errors.technicianId}
      />
      <TextField
        label="Hourly rate ($)"
        name="hourly"
        inputMode="decimal"
        value={form.hourly}
        onChange={set("hourly")}
        error={errors.hourlyRateCents}
      />
      <TextField
        label="Travel rate ($ per hour)"
        name="travel"
        inputMode="decimal"
        value={form.travel}
        onChange={set("travel")}
      />
      <TextField
        label="Mileage rate ($ per mile)"
        name="mileage"
        inputMode="decimal"
        value={form.mileage}
        onChange={set("mileage")}
      />
      <TextField
        label="Hours on site"
        name="hours"
        inputMode="decimal"
        value={form.hours}
        onChange={set("hours")}
        hint="In quarter hours"
        error={errors.onSiteHours}
      />
      <TextField
        label="Earliest arrival"
        name="arrival"
        type="datetime-local"
        value={form.arrival}
        onChange={set("arrival")}
        hint={`On the site's clock (${timeZone})`}
        error={errors.earliestArrival}
      />
      <TextField
        label="Part to bring or order"
        name="partName"
        value={form.partName}
        onChange={set("partName")}
      />
      <TextField
        label="Part price ($, if known)"
        name="partPrice"
        inputMode="decimal"
        value={form.partPrice}
        onChange={set("partPrice")}
      />
      <TextAreaField label="Note" name="note" rows={3} value={form.note} onChange={set("note")} />
      <TextField
        label="Valid until"
        name="validUntil"
        type="date"
        value={form.validUntil}
        onChange={set("validUntil")}
        error={errors.validUntil}
      />
      <p className="text-sm text-ink-600">
        The total (travel both ways, labor, mileage, priced parts) is worked out for you, before tax.
      </p>
      <Button type="submit" pending={pending} className="w-full sm:w-auto">
        {submitLabel}
      </Button>
    </form>
  );
}
