import { useState, type FormEvent } from "react";
import {
  equipmentInputSchema,
  type EquipmentDto as Equipment,
  type EquipmentInput,
} from "@shared/sites/schemas.ts";
import { machineTechnologies, technologyLabels } from "@shared/technicians/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { CatalogCombobox } from "@/components/ui/catalog-combobox.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { readForm } from "@/lib/read-form.ts";

const labels = {
  builder: "Machine builder",
  controlFamily: "Control family",
  technology: "Technology",
  model: "Model",
  serialNumber: "Serial number",
  building: "Building",
  bay: "Bay",
};

// An empty field clears the value on an edit; on an add it simply leaves it unrecorded.
const orNull = (v: string | undefined) => (v && v.trim() ? v : null);

export const technologyOptions = machineTechnologies.map((t) => ({ value: t, label: technologyLabels[t] }));

type EquipmentFormProps = {
  equipment?: Equipment | undefined;
  pending: boolean;
  serverError: unknown;
  onSubmit: (input: EquipmentInput) => void;
  onCancel?: () => void;
};

/**
 * One machine at a site; what it says fills the directory's technology and control-family filters, and the building
 * and bay tell a technician where on the site it stands.
 */
export function EquipmentForm({ equipment, pending, serverError, onSubmit, onCancel }: EquipmentFormProps) {
  const [invalid, setInvalid] = useState<unknown>(null);
  // A new key after each added machine starts the fields afresh (the pickers keep their own state).
  const [round, setRound] = useState(0);
  const problem = invalid ?? serverError;
  const fields = fieldErrorsOf(problem);

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = event.currentTarget;
    const values = readForm(form);
    const parsed = equipmentInputSchema.safeParse({
      ...values,
      serialNumber: values.serialNumber || undefined,
      building: orNull(values.building),
      bay: orNull(values.bay),
    });
    if (!parsed.success) {
      setInvalid(parsed.error);
      return;
    }
    setInvalid(null);
    onSubmit(parsed.data);
    if (!equipment) {
      form.reset();
      setRound((r) => r + 1);
    }
  };

  return (
    <form
      noValidate
      onSubmit={submit}
      className="space-y-3"
      aria-label={equipment ? "Edit machine" : "Add a machine"}
    >
      <FormError error={problem} labels={labels} />
      <div key={round} className="grid gap-3 sm:grid-cols-3">
        <CatalogCombobox
          kind="builder"
          label={labels.builder}
          name="builder"
          defaultValue={equipment?.builder}
          error={fields.builder}
        />
        <CatalogCombobox
          kind="control_family"
          label={labels.controlFamily}
          name="controlFamily"
          defaultValue={equipment?.controlFamily}
          error={fields.controlFamily}
        />
        <SelectField
          label={labels.technology}
          name="technology"
          options={technologyOptions}
          placeholder="Choose"
          defaultValue={equipment?.technology ?? ""}
          error={fields.technology}
        />
        <TextField label={labels.model} name="model" defaultValue={equipment?.model} error={fields.model} />
        <TextField
          label={labels.serialNumber}
          name="serialNumber"
          defaultValue={equipment?.serialNumber ?? ""}
          hint="Optional"
          error={fields.serialNumber}
        />
        <TextField
          label={labels.building}
          name="building"
          defaultValue={equipment?.building ?? ""}
          hint="Optional"
          error={fields.building}
        />
        <TextField
          label={labels.bay}
          name="bay"
          defaultValue={equipment?.bay ?? ""}
          hint="Optional"
          error={fields.bay}
        />
      </div>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant="secondary" pending={pending} pendingLabel="Saving">
          {equipment ? "Save machine" : "Add machine"}
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
