import { useMemo, useState, type FormEvent } from "react";
import { requirementSetInputSchema, type RequirementSetInput } from "@shared/standing/schemas.ts";
import {
  emptyRequirementDraft,
  fromRequirementDraft,
  toRequirementDraft,
  type RequirementDraft,
} from "@/components/requirements/requirement-draft.ts";
import {
  RequirementFields,
  type CredentialTypeChoice,
} from "@/components/requirements/requirement-fields.tsx";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { SelectField, type SelectOption } from "@/components/ui/select-field.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { useRequirementSetPreview } from "../api/preview-requirement-set.ts";
import type { RequirementSetDto as RequirementSetView } from "@shared/standing/schemas.ts";
import { useDebouncedValue } from "./use-debounced-value.ts";

type RequirementSetEditorProps = {
  set?: RequirementSetView | undefined;
  siteOptions: readonly SelectOption[];
  credentialTypes: readonly CredentialTypeChoice[];
  pending: boolean;
  serverError: unknown;
  onSubmit: (input: RequirementSetInput) => void;
  onCancel: () => void;
};

function toInput(name: string, siteId: string, drafts: readonly RequirementDraft[]) {
  return {
    name,
    siteId: siteId === "" ? null : Number(siteId),
    requirements: drafts.map(fromRequirementDraft),
  };
}

function PreviewCount({ input }: { input: RequirementSetInput | null }) {
  const preview = useRequirementSetPreview(useDebouncedValue(input, 400));
  let text: string;
  if (!input) text = "Complete the requirements to see how many technicians meet them today.";
  else if (preview.isError) text = "The count could not be worked out just now.";
  else if (!preview.data) text = "Counting…";
  else
    text = `${preview.data.meeting} of ${preview.data.technicians} technicians meet this today${
      preview.data.lapsing > 0 ? ` (${preview.data.lapsing} of them lapsing soon)` : ""
    }.`;
  return (
    <p
      role="status"
      aria-live="polite"
      className="rounded-md border border-ink-100 bg-ink-50 px-4 py-3 text-sm font-medium text-ink-900"
    >
      {text}
      {preview.isFetching && input && <span className="sr-only"> Updating.</span>}
    </p>
  );
}

/** The editor for one set, checked with the shared schema as it changes, with a live count of who meets it. */
export function RequirementSetEditor(props: RequirementSetEditorProps) {
  const { set, siteOptions, credentialTypes, pending, serverError, onSubmit, onCancel } = props;
  const [name, setName] = useState(set?.name ?? "");
  const [siteId, setSiteId] = useState(set?.siteId?.toString() ?? "");
  const [drafts, setDrafts] = useState<RequirementDraft[]>(() =>
    set ? set.requirements.map(toRequirementDraft) : [emptyRequirementDraft()],
  );
  const [showErrors, setShowErrors] = useState(false);
  const parsed = useMemo(
    () => requirementSetInputSchema.safeParse(toInput(name, siteId, drafts)),
    [name, siteId, drafts],
  );
  const problem = showErrors && !parsed.success ? parsed.error : serverError;
  const errors = fieldErrorsOf(problem);

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    if (!parsed.success) {
      setShowErrors(true);
      return;
    }
    setShowErrors(false);
    onSubmit(parsed.data);
  };

  return (
    <form
      noValidate
      onSubmit={submit}
      className="space-y-5"
      aria-label={set ? `Edit ${set.name}` : "New requirement set"}
    >
      <FormError error={problem} />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="Name"
          name="name"
          value={name}
          onChange={(e) => setName(e.target.value)}
          error={errors.name}
        />
        <SelectField
          label="Site"
          name="siteId"
          options={siteOptions}
          placeholder="Every site"
          value={siteId}
          onChange={(e) => setSiteId(e.target.value)}
          error={errors.siteId}
        />
      </div>
      <PreviewCount input={parsed.success ? parsed.data : null} />
      {drafts.map((draft, index) => (
        <RequirementFields
          key={draft.key}
          index={index}
          draft={draft}
          credentialTypes={credentialTypes}
          errors={errors}
          onChange={(next) => setDrafts(drafts.map((d) => (d.key === draft.key ? next : d)))}
          onRemove={
            drafts.length > 1 ? () => setDrafts(drafts.filter((d) => d.key !== draft.key)) : undefined
          }
          additionalInsuredLabel="Shop named as additional insured"
        />
      ))}
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" onClick={() => setDrafts([...drafts, emptyRequirementDraft()])}>
          Add a requirement
        </Button>
        <Button type="submit" pending={pending} pendingLabel="Saving">
          Save requirement set
        </Button>
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
