import { useMemo, useState, type FormEvent } from "react";
import { baselineInputSchema, type BaselineInput } from "@shared/standing/schemas.ts";
import {
  emptyRequirementDraft,
  fromRequirementDraft,
  offeredLimits,
  toRequirementDraft,
  type RequirementDraft,
} from "@/components/requirements/requirement-draft.ts";
import {
  RequirementFields,
  type CredentialTypeChoice,
} from "@/components/requirements/requirement-fields.tsx";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import type { Baseline } from "../api/get-baseline.ts";
import { useSaveBaseline } from "../api/save-baseline.ts";

const fieldLabels: Record<string, string> = {
  label: "name",
  typeCodes: "credential types",
  maxAgeMonths: "card age",
  builder: "Machine builder",
  controlFamily: "OEM control family",
  minLevel: "minimum OEM level",
};

// The error summary names a field as the form shows it ("Requirement 3, name"), not by its path ("requirements.2.label").
function labelsFor(count: number): Record<string, string> {
  const out: Record<string, string> = { requirements: "Requirements" };
  for (let i = 0; i < count; i++) {
    for (const [field, label] of Object.entries(fieldLabels))
      out[`requirements.${i}.${field}`] = `Requirement ${i + 1}, ${label}`;
    for (const [name, label] of offeredLimits)
      out[`requirements.${i}.minLimits.${name}`] = `Requirement ${i + 1}, ${label.replace(" ($)", "")}`;
  }
  return out;
}

type BaselineEditorProps = {
  baseline: Baseline;
  credentialTypes: readonly CredentialTypeChoice[];
  onSaved: () => void;
  onCancel: () => void;
};

/**
 * The platform baseline, checked with the shared schema as it changes. Saving asks once more, because the server
 * recomputes every technician's standing with it and anyone who stops meeting it drops out of buyers' view at once.
 */
export function BaselineEditor({ baseline, credentialTypes, onSaved, onCancel }: BaselineEditorProps) {
  const save = useSaveBaseline();
  const [drafts, setDrafts] = useState<RequirementDraft[]>(() =>
    baseline.requirements.map(toRequirementDraft),
  );
  const [showErrors, setShowErrors] = useState(false);
  const [confirming, setConfirming] = useState<BaselineInput | null>(null);
  const parsed = useMemo(
    () => baselineInputSchema.safeParse({ requirements: drafts.map(fromRequirementDraft) }),
    [drafts],
  );
  const problem = showErrors && !parsed.success ? parsed.error : save.error;
  const errors = fieldErrorsOf(problem);

  const change = (next: RequirementDraft[]) => {
    setDrafts(next);
    setConfirming(null);
  };

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    if (!parsed.success) {
      setShowErrors(true);
      return;
    }
    setShowErrors(false);
    setConfirming(parsed.data);
  };

  return (
    <form noValidate onSubmit={submit} className="space-y-5" aria-label="Platform baseline">
      <FormError error={problem} labels={labelsFor(drafts.length)} />
      {drafts.map((draft, index) => (
        <RequirementFields
          key={draft.key}
          index={index}
          draft={draft}
          credentialTypes={credentialTypes}
          errors={errors}
          onChange={(next) => change(drafts.map((d) => (d.key === draft.key ? next : d)))}
          onRemove={drafts.length > 1 ? () => change(drafts.filter((d) => d.key !== draft.key)) : undefined}
          additionalInsuredLabel="Additional insured endorsement"
          opensForUnlistedLimits
        />
      ))}
      {confirming ? (
        <div
          role="alert"
          className="space-y-3 rounded-md border-l-4 border-accent-500 bg-amber-50 px-4 py-3 text-sm text-ink-900"
        >
          <p className="font-semibold">
            Save {confirming.requirements.length}{" "}
            {confirming.requirements.length === 1 ? "requirement" : "requirements"} and recompute every
            technician&apos;s standing now?
          </p>
          <p>Technicians who no longer meet the baseline stop appearing to buyers straight away.</p>
          <div className="flex flex-wrap gap-2">
            <Button
              pending={save.isPending}
              pendingLabel="Saving and recomputing…"
              onClick={() =>
                save.mutate(confirming, {
                  onSuccess: (saved) => {
                    setDrafts(saved.requirements.map(toRequirementDraft));
                    setConfirming(null);
                    onSaved();
                  },
                })
              }
            >
              Save and recompute
            </Button>
            <Button variant="quiet" disabled={save.isPending} onClick={() => setConfirming(null)}>
              Keep editing
            </Button>
          </div>
        </div>
      ) : (
        <div className="flex flex-wrap gap-2">
          <Button variant="secondary" onClick={() => change([...drafts, emptyRequirementDraft()])}>
            Add a requirement
          </Button>
          <Button type="submit">Save baseline</Button>
          <Button
            variant="quiet"
            onClick={() => {
              save.reset();
              onCancel();
            }}
          >
            Cancel
          </Button>
        </div>
      )}
    </form>
  );
}
