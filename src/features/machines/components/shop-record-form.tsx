import { useState, type FormEvent } from "react";
import {
  problemAreaLabels,
  problemAreas,
  readPartLines,
  recordShopServiceSchema,
  workKinds,
  type RecordShopService,
} from "@shared/machines/service-history.ts";
import { requestKindLabels } from "@shared/service-requests/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { TextAreaField } from "@/components/ui/text-area-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { readForm } from "@/lib/read-form.ts";

const labels = {
  performedOn: "Date of the work",
  kind: "Kind of work",
  problemArea: "Problem area",
  serviceCompanyName: "Service company",
  technicianName: "Technician",
  hoursOnSite: "Hours on site",
  travelHours: "Travel hours",
  note: "What was done",
  partsUsed: "Parts used",
};

type ShopRecordFormProps = {
  pending: boolean;
  serverError: unknown;
  onSubmit: (input: RecordShopService) => void;
  onCancel: () => void;
};

const hoursOf = (v: string | undefined) => (v && v.trim() ? Number(v) : null);

/** Work done outside the platform; it shows as "recorded by the shop" and never reaches a rating. */
export function ShopRecordForm({ pending, serverError, onSubmit, onCancel }: ShopRecordFormProps) {
  const [invalid, setInvalid] = useState<unknown>(null);
  const problem = invalid ?? serverError;
  const fields = fieldErrorsOf(problem);

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const v = readForm(event.currentTarget);
    const parsed = recordShopServiceSchema.safeParse({
      performedOn: v.performedOn,
      kind: v.kind || undefined,
      problemArea: v.problemArea || null,
      serviceCompanyName: v.serviceCompanyName || null,
      technicianName: v.technicianName || null,
      hoursOnSite: hoursOf(v.hoursOnSite),
      travelHours: hoursOf(v.travelHours),
      note: v.note,
      partsUsed: readPartLines(v.partsUsed ?? ""),
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
      aria-label="Record outside work"
      className="space-y-3 rounded-lg border border-ink-100 bg-white p-4"
    >
      <FormError error={problem} labels={labels} />
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label={labels.performedOn} name="performedOn" type="date" error={fields.performedOn} />
        <SelectField
          label={labels.kind}
          name="kind"
          placeholder="Choose"
          options={workKinds.map((k) => ({ value: k, label: requestKindLabels[k] }))}
          error={fields.kind}
        />
        <SelectField
          label={labels.problemArea}
          name="problemArea"
          placeholder="Not stated"
          options={problemAreas.map((a) => ({ value: a, label: problemAreaLabels[a] }))}
          hint="Repeat faults are matched on this"
          error={fields.problemArea}
        />
        <TextField
          label={labels.serviceCompanyName}
          name="serviceCompanyName"
          hint="Optional"
          error={fields.serviceCompanyName}
        />
        <TextField
          label={labels.technicianName}
          name="technicianName"
          hint="Optional"
          error={fields.technicianName}
        />
        <div className="grid grid-cols-2 gap-3">
          <TextField
            label={labels.hoursOnSite}
            name="hoursOnSite"
            inputMode="decimal"
            error={fields.hoursOnSite}
          />
          <TextField
            label={labels.travelHours}
            name="travelHours"
            inputMode="decimal"
            error={fields.travelHours}
          />
        </div>
      </div>
      <TextAreaField label={labels.note} name="note" rows={3} error={fields.note} />
      <TextAreaField
        label={labels.partsUsed}
        name="partsUsed"
        rows={2}
        hint="One part a line, e.g. 2 × Way wiper, WW-220"
        error={fields.partsUsed}
      />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" pending={pending} pendingLabel="Saving">
          Save record
        </Button>
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
