import { useState, type FormEvent } from "react";
import {
  equipmentInputSchema,
  machineStates,
  type EquipmentInput,
  type MachineDto as Machine,
} from "@shared/sites/schemas.ts";
import { machineTechnologies, technologyLabels } from "@shared/technicians/schemas.ts";
import { machineStateLabels } from "@shared/machines/machine-states.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { TextAreaField } from "@/components/ui/text-area-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { readForm } from "@/lib/read-form.ts";

const labels = {
  builder: "Machine builder",
  controlFamily: "Control family",
  technology: "Technology",
  model: "Model",
  serialNumber: "Serial number",
  yearBuilt: "Year built",
  inServiceOn: "In service since",
  building: "Building",
  bay: "Bay",
  notes: "Notes",
  state: "State",
};

type MachineRecordFormProps = {
  machine: Machine;
  pending: boolean;
  serverError: unknown;
  onSubmit: (input: EquipmentInput) => void;
  onCancel: () => void;
};

const orNull = (v: string | undefined) => (v && v.trim() ? v : null);

/** Every field of the record, the state included; the serial stays unique per builder on the platform. */
export function MachineRecordForm({
  machine,
  pending,
  serverError,
  onSubmit,
  onCancel,
}: MachineRecordFormProps) {
  const [invalid, setInvalid] = useState<unknown>(null);
  const problem = invalid ?? serverError;
  const fields = fieldErrorsOf(problem);

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const v = readForm(event.currentTarget);
    const parsed = equipmentInputSchema.safeParse({
      ...v,
      serialNumber: v.serialNumber || undefined,
      yearBuilt: v.yearBuilt ? Number(v.yearBuilt) : null,
      inServiceOn: orNull(v.inServiceOn),
      building: orNull(v.building),
      bay: orNull(v.bay),
      notes: orNull(v.notes),
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
      aria-label="Edit machine"
      className="space-y-3 rounded-lg border border-ink-100 bg-white p-4"
    >
      <FormError error={problem} labels={labels} />
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField
          label={labels.builder}
          name="builder"
          defaultValue={machine.builder}
          error={fields.builder}
        />
        <TextField
          label={labels.controlFamily}
          name="controlFamily"
          defaultValue={machine.controlFamily}
          error={fields.controlFamily}
        />
        <SelectField
          label={labels.technology}
          name="technology"
          options={machineTechnologies.map((t) => ({ value: t, label: technologyLabels[t] }))}
          defaultValue={machine.technology}
          error={fields.technology}
        />
        <TextField label={labels.model} name="model" defaultValue={machine.model} error={fields.model} />
        <TextField
          label={labels.serialNumber}
          name="serialNumber"
          defaultValue={machine.serialNumber ?? ""}
          error={fields.serialNumber}
        />
        <TextField
          label={labels.yearBuilt}
          name="yearBuilt"
          inputMode="numeric"
          defaultValue={machine.yearBuilt ? String(machine.yearBuilt) : ""}
          error={fields.yearBuilt}
        />
        <TextField
          label={labels.inServiceOn}
          name="inServiceOn"
          type="date"
          defaultValue={machine.inServiceOn ?? ""}
          error={fields.inServiceOn}
        />
        <SelectField
          label={labels.state}
          name="state"
          options={machineStates.map((s) => ({ value: s, label: machineStateLabels[s] }))}
          defaultValue={machine.state ?? "running"}
          error={fields.state}
        />
        <TextField
          label={labels.building}
          name="building"
          defaultValue={machine.building ?? ""}
          error={fields.building}
        />
        <TextField label={labels.bay} name="bay" defaultValue={machine.bay ?? ""} error={fields.bay} />
      </div>
      <TextAreaField
        label={labels.notes}
        name="notes"
        defaultValue={machine.notes ?? ""}
        rows={3}
        error={fields.notes}
      />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" pending={pending} pendingLabel="Saving">
          Save machine
        </Button>
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
