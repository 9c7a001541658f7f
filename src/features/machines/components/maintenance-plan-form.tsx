import { useState, type FormEvent } from "react";
import {
  maintenancePlanInputSchema,
  type MaintenanceIntervalKind,
  type MaintenancePlanDto,
  type MaintenancePlanInput,
} from "@shared/machines/maintenance-schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { readForm } from "@/lib/read-form.ts";

const labels = {
  name: "What is done",
  intervalKind: "Counted in",
  intervalMonths: "Every (months)",
  intervalHours: "Every (running hours)",
  lastDoneOn: "Last done on",
  lastDoneHours: "Meter hours when last done",
};

const kindOptions = [
  { value: "months", label: "Calendar months" },
  { value: "hours", label: "Running hours" },
];

const wholeNumber = (value: string | undefined) =>
  value === undefined || value.trim() === "" ? undefined : Number(value);

type MaintenancePlanFormProps = {
  plan?: MaintenancePlanDto | undefined;
  pending: boolean;
  serverError: unknown;
  onSubmit: (input: MaintenancePlanInput) => void;
  onCancel?: () => void;
};

/** One maintenance plan: what is done and how often, by the calendar or by the machine's running-hours meter. */
export function MaintenancePlanForm({
  plan,
  pending,
  serverError,
  onSubmit,
  onCancel,
}: MaintenancePlanFormProps) {
  const [kind, setKind] = useState<MaintenanceIntervalKind>(plan?.intervalKind ?? "months");
  const [invalid, setInvalid] = useState<unknown>(null);
  const problem = invalid ?? serverError;
  const fields = fieldErrorsOf(problem);

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = event.currentTarget;
    const values = readForm(form);
    const months = kind === "months";
    const parsed = maintenancePlanInputSchema.safeParse({
      name: values.name,
      intervalKind: kind,
      intervalMonths: months ? wholeNumber(values.intervalMonths) : undefined,
      intervalHours: months ? undefined : wholeNumber(values.intervalHours),
      lastDoneOn: months ? values.lastDoneOn || undefined : undefined,
      lastDoneHours: months ? undefined : wholeNumber(values.lastDoneHours),
    });
    if (!parsed.success) {
      setInvalid(parsed.error);
      return;
    }
    setInvalid(null);
    onSubmit(parsed.data);
    if (!plan) form.reset();
  };

  return (
    <form
      noValidate
      onSubmit={submit}
      className="space-y-3"
      aria-label={plan ? `Edit ${plan.name}` : "Add a maintenance plan"}
    >
      <FormError error={problem} labels={labels} />
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField
          label={labels.name}
          name="name"
          defaultValue={plan?.name}
          placeholder="Annual inspection"
          error={fields.name}
        />
        <SelectField
          label={labels.intervalKind}
          name="intervalKind"
          options={kindOptions}
          value={kind}
          onChange={(e) => setKind(e.target.value as MaintenanceIntervalKind)}
          error={fields.intervalKind}
        />
        {kind === "months" ? (
          <>
            <TextField
              label={labels.intervalMonths}
              name="intervalMonths"
              type="number"
              inputMode="numeric"
              min={1}
              max={120}
              defaultValue={plan?.intervalMonths ?? 12}
              error={fields.intervalMonths}
            />
            <TextField
              label={labels.lastDoneOn}
              name="lastDoneOn"
              type="date"
              defaultValue={plan?.lastDoneOn ?? ""}
              error={fields.lastDoneOn}
            />
          </>
        ) : (
          <>
            <TextField
              label={labels.intervalHours}
              name="intervalHours"
              type="number"
              inputMode="numeric"
              min={1}
              defaultValue={plan?.intervalHours ?? 2000}
              error={fields.intervalHours}
            />
            <TextField
              label={labels.lastDoneHours}
              name="lastDoneHours"
              type="number"
              inputMode="numeric"
              min={0}
              defaultValue={plan?.lastDoneHours ?? ""}
              error={fields.lastDoneHours}
            />
          </>
        )}
      </div>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant="secondary" pending={pending} pendingLabel="Saving">
          {plan ? "Save plan" : "Add plan"}
        </Button>
        {onCancel && (
          <Button variant="quiet" onClick={onCancel}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}
