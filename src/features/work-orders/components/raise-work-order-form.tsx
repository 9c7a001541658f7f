import { useState, type FormEvent } from "react";
import { raiseWorkOrderSchema, urgencies, type RaiseWorkOrder } from "@shared/work-orders/schemas.ts";
import { machineTechnologies, technologyLabels } from "@shared/technicians/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { ChoiceGroup } from "@/components/ui/choice-group.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { SelectField, type SelectOption } from "@/components/ui/select-field.tsx";
import { TextAreaField } from "@/components/ui/text-area-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { isApiError } from "@/lib/api-client.ts";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { centsToInput, inputToCents } from "@/lib/format-money.ts";
import { preferredDateWindow } from "@shared/work-orders/preferred-dates.ts";
import { problemAreaLabels, problemAreas, workKinds } from "@shared/machines/service-history.ts";
import { requestKindLabels } from "@shared/service-requests/schemas.ts";

import { urgencyWords } from "./work-order-words.ts";

const localIsoDate = (d: Date) =>
  `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, "0")}-${String(d.getDate()).padStart(2, "0")}`;

/** What the chosen site records for a visiting technician; a new work order starts from it. */
export type SiteDefaults = {
  contactName?: string | null | undefined;
  contactPhone?: string | null | undefined;
  safetyInductionNote?: string | null | undefined;
  defaultPoNumber?: string | null | undefined;
  defaultNotToExceedCents?: number | null | undefined;
};

export type MachineChoice = { id: number; label: string; technology: string };

type RaiseWorkOrderFormProps = {
  technicianId: number;
  technicianName: string;
  sites: readonly SelectOption[];
  siteId: string;
  siteDefaults: SiteDefaults | null;
  onSiteChange: (siteId: string) => void;
  machines: readonly MachineChoice[];
  requirementSets: readonly SelectOption[];
  /** Follows the site: its own set is chosen for it, and the buyer may pick another. */
  requirementSetId: string;
  onRequirementSetChange: (requirementSetId: string) => void;
  pending: boolean;
  serverError: unknown;
  onSubmit: (input: RaiseWorkOrder) => void;
};

const labels = {
  siteId: "Site",
  equipmentId: "Machine",
  technology: "Technology",
  problem: "What is wrong",
  urgency: "Urgency",
  preferredDates: "Preferred dates",
  requirementSetId: "Requirement set to check",
  kind: "Kind of work",
  problemArea: "Problem area",
  siteContactName: "On-site contact",
  siteContactPhone: "Contact's phone",
  poNumber: "PO number",
  notToExceedCents: "Not to exceed (dollars)",
  safetyInductionNote: "Site safety induction",
};
const plainWords = {
  siteId: "Choose the site",
  technology: "Choose the technology or a machine",
  notToExceedCents: "Enter dollars and cents, e.g. 2450.00",
};
const DATE_INPUTS = 3;
const technologyOptions = machineTechnologies.map((t) => ({ value: t, label: technologyLabels[t] }));

/** A 409 names every requirement the technician does not meet now; each one is listed, not only the first. */
function NotClearedReasons({ error }: { error: unknown }) {
  if (!isApiError(error) || error.status !== 409) return null;
  return (
    <div
      role="alert"
      className="rounded-md border-l-4 border-red-700 bg-red-50 px-4 py-3 text-sm text-red-900"
    >
      <p className="font-semibold">{error.message}</p>
      {error.fields.length > 0 && (
        <ul className="mt-1 list-disc space-y-0.5 pl-5">
          {error.fields.map((f, i) => (
            <li key={i}>{f.message}</li>
          ))}
        </ul>
      )}
    </div>
  );
}

export function RaiseWorkOrderForm(props: RaiseWorkOrderFormProps) {
  const {
    technicianId,
    technicianName,
    sites,
    siteId,
    siteDefaults,
    onSiteChange,
    machines,
    requirementSets,
    requirementSetId,
    onRequirementSetChange,
    pending,
    serverError,
    onSubmit,
  } = props;
  const [invalid, setInvalid] = useState<unknown>(null);
  const [technology, setTechnology] = useState("");
  const [equipmentId, setEquipmentId] = useState("");
  const conflict = isApiError(serverError) && serverError.status === 409;
  const problem = invalid ?? (conflict ? null : serverError);
  const errors = fieldErrorsOf(problem, plainWords);
  // The reader's own calendar date; the server checks again against its clock.
  const dateWindow = preferredDateWindow(localIsoDate(new Date()));

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const text = (name: string) => String(data.get(name) ?? "").trim();
    const parsed = raiseWorkOrderSchema.safeParse({
      technicianId,
      siteId: text("siteId") || undefined,
      equipmentId: text("equipmentId") || undefined,
      requirementSetId: text("requirementSetId") || null,
      technology: text("technology") || undefined,
      problem: text("problem"),
      urgency: text("urgency") || undefined,
      preferredDates: data.getAll("preferredDates").map(String).filter(Boolean),
      kind: text("kind") || undefined,
      problemArea: text("problemArea") || undefined,
      siteContactName: text("siteContactName") || undefined,
      siteContactPhone: text("siteContactPhone") || undefined,
      poNumber: text("poNumber") || undefined,
      notToExceedCents: text("notToExceed") ? inputToCents(text("notToExceed")) : undefined,
      safetyInductionNote: text("safetyInductionNote") || undefined,
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
      className="max-w-3xl space-y-5"
      aria-label={`Work order for ${technicianName}`}
    >
      <NotClearedReasons error={serverError} />
      <FormError error={problem} labels={labels} plainWords={plainWords} />
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField
          label={labels.siteId}
          name="siteId"
          options={sites}
          placeholder="Choose a site"
          value={siteId}
          onChange={(e) => {
            onSiteChange(e.target.value);
            setEquipmentId("");
          }}
          error={errors.siteId}
        />
        <SelectField
          label={labels.equipmentId}
          name="equipmentId"
          options={machines.map((m) => ({ value: String(m.id), label: m.label }))}
          placeholder={
            machines.length === 0 ? "No machines recorded at this site" : "Not one machine in particular"
          }
          disabled={machines.length === 0}
          value={equipmentId}
          onChange={(e) => {
            setEquipmentId(e.target.value);
            const machine = machines.find((m) => String(m.id) === e.target.value);
            if (machine) setTechnology(machine.technology);
          }}
          error={errors.equipmentId}
        />
        <SelectField
          label={labels.technology}
          name="technology"
          options={technologyOptions}
          placeholder="Choose"
          value={technology}
          onChange={(e) => setTechnology(e.target.value)}
          hint="Filled from the machine"
          error={errors.technology}
        />
        <SelectField
          label={labels.requirementSetId}
          name="requirementSetId"
          options={requirementSets}
          placeholder="Platform baseline only (company insurance)"
          value={requirementSetId}
          onChange={(e) => onRequirementSetChange(e.target.value)}
          error={errors.requirementSetId}
        />
        <SelectField
          label={labels.kind}
          name="kind"
          options={workKinds.map((k) => ({ value: k, label: requestKindLabels[k] }))}
          placeholder="Not stated"
          hint="Kept in the machine's service history"
          error={errors.kind}
        />
        <SelectField
          label={labels.problemArea}
          name="problemArea"
          options={problemAreas.map((a) => ({ value: a, label: problemAreaLabels[a] }))}
          placeholder="Not stated"
          hint="Repeat faults on a machine are matched on this"
          error={errors.problemArea}
        />
      </div>
      <TextAreaField label={labels.problem} name="problem" rows={5} error={errors.problem} />
      <ChoiceGroup
        legend={labels.urgency}
        name="urgency"
        options={urgencies.map((u) => ({ value: u, label: urgencyWords[u] }))}
        defaultValue="normal"
        error={errors.urgency}
      />
      <fieldset>
        <legend className="mb-1 text-sm font-medium text-ink-900">{labels.preferredDates} (optional)</legend>
        <div className="grid gap-3 sm:grid-cols-3">
          {Array.from({ length: DATE_INPUTS }, (_, i) => (
            <TextField
              key={i}
              label={`Preferred date ${i + 1}`}
              name="preferredDates"
              type="date"
              min={dateWindow.earliest}
              max={dateWindow.latest}
              error={errors[`preferredDates.${i}`] ?? (i === 0 ? errors.preferredDates : undefined)}
            />
          ))}
        </div>
      </fieldset>
      <fieldset key={siteId} className="space-y-3">
        <legend className="mb-1 text-sm font-medium text-ink-900">
          On site (sent once the job is accepted)
        </legend>
        <p className="text-sm text-ink-700">
          The technician sees these, with the site&apos;s street address, only after accepting. Contact,
          induction, PO and limit start from the site.
        </p>
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField
            label={labels.siteContactName}
            name="siteContactName"
            defaultValue={siteDefaults?.contactName ?? ""}
            error={errors.siteContactName}
          />
          <TextField
            label={labels.siteContactPhone}
            name="siteContactPhone"
            type="tel"
            defaultValue={siteDefaults?.contactPhone ?? ""}
            error={errors.siteContactPhone}
          />
          <TextField
            label={labels.poNumber}
            name="poNumber"
            hint="Optional"
            defaultValue={siteDefaults?.defaultPoNumber ?? ""}
            error={errors.poNumber}
          />
          <TextField
            label={labels.notToExceedCents}
            name="notToExceed"
            inputMode="decimal"
            defaultValue={centsToInput(siteDefaults?.defaultNotToExceedCents)}
            hint="Optional; the technician asks before going past it"
            error={errors.notToExceedCents}
          />
        </div>
        <TextAreaField
          label={labels.safetyInductionNote}
          name="safetyInductionNote"
          rows={2}
          defaultValue={siteDefaults?.safetyInductionNote ?? ""}
          error={errors.safetyInductionNote}
        />
      </fieldset>
      <Button type="submit" pending={pending} pendingLabel="Sending">
        Send work order
      </Button>
    </form>
  );
}
