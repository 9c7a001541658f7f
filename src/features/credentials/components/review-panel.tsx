import { useMemo, useRef, useState } from "react";
import type { FieldSet } from "@shared/credentials/credential-fields.ts";
import { LOW_CONFIDENCE } from "@shared/credentials/locate-values.ts";
import { isApiError } from "@/lib/api-client.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { StatusBadge } from "@/components/ui/status-badge.tsx";
import type {
  CredentialDto as Credential,
  CredentialDetailDto as CredentialDetail,
} from "@shared/credentials/credential-shapes.ts";
import { useEditCredentialFields } from "../api/edit-credential-fields.ts";
import { useReturnCredential } from "../api/return-credential.ts";
import { useVerifyCredential } from "../api/verify-credential.ts";
import { CredentialFieldsForm } from "./credential-fields-form.tsx";
import { fieldDefinitionsFor } from "./field-definitions.ts";
import { credentialFieldErrorsOf, labelsOf, problemsAsError } from "./field-problems.ts";
import { parseFieldValues, toFieldValues, type FieldValues } from "./field-values.ts";
import { ReturnReasonForm } from "./return-reason-form.tsx";
import { ReviewerWarnings } from "./reviewer-warnings.tsx";
import { useReviewShortcuts } from "./use-review-shortcuts.ts";

type ReviewPanelProps = {
  credential: CredentialDetail;
  fieldSet: FieldSet;
  onDecided: (decided: Credential) => void;
  onFocusField?: (path: string) => void;
};

const conflictWords = "Another reviewer decided this first.";
const noFound: ReadonlySet<string> = new Set();

/** The right-hand side of the review page: the fields (editable), the checks beside them, and the two decisions. */
export function ReviewPanel({ credential, fieldSet, onDecided, onFocusField }: ReviewPanelProps) {
  const definitions = useMemo(
    () => fieldDefinitionsFor(fieldSet, credential.typeCode),
    [fieldSet, credential.typeCode],
  );
  const initial = useMemo(
    () => toFieldValues(definitions, credential.fields),
    [definitions, credential.fields],
  );
  const [values, setValues] = useState<FieldValues>(initial);
  const doubtful = useMemo(
    () =>
      new Set(
        Object.entries(credential.evidence)
          .filter(([, e]) => e.confidence < LOW_CONFIDENCE)
          .map(([path]) => path),
      ),
    [credential.evidence],
  );
  const [problems, setProblems] = useState<Record<string, string>>({});
  const [summary, setSummary] = useState<unknown>(null);
  const [conflict, setConflict] = useState(false);
  const reasonRef = useRef<HTMLTextAreaElement>(null);
  const verify = useVerifyCredential();
  const giveBack = useReturnCredential();
  const save = useEditCredentialFields();
  const open = credential.state === "submitted";
  const busy = verify.isPending || giveBack.isPending || save.isPending;
  const dirty = JSON.stringify(values) !== JSON.stringify(initial);

  const fieldsOrNull = (): Record<string, unknown> | null => {
    const parsed = parseFieldValues(fieldSet, definitions, values);
    if (parsed.ok) {
      setProblems({});
      return parsed.fields;
    }
    setProblems(parsed.problems);
    setSummary(problemsAsError("Check the fields marked below.", parsed.problems));
    return null;
  };

  const showError = (error: unknown) => {
    if (isApiError(error) && error.code === "conflict") {
      setConflict(true);
      setSummary(null);
      return;
    }
    const mapped = credentialFieldErrorsOf(error);
    setProblems(mapped);
    setSummary(
      Object.keys(mapped).length > 0 && isApiError(error) ? problemsAsError(error.message, mapped) : error,
    );
  };

  const decideVerify = () => {
    if (!open || busy) return;
    setSummary(null);
    const fields = dirty ? fieldsOrNull() : undefined;
    if (fields === null) return;
    verify.mutate({ id: credential.id, fields }, { onSuccess: onDecided, onError: showError });
  };

  const decideReturn = (reason: string) => {
    if (!open || busy) return;
    setSummary(null);
    giveBack.mutate({ id: credential.id, reason }, { onSuccess: onDecided, onError: showError });
  };

  const saveFields = () => {
    setSummary(null);
    const fields = fieldsOrNull();
    if (fields) save.mutate({ id: credential.id, fields }, { onError: showError });
  };

  useReviewShortcuts(open, { verify: decideVerify, focusReturn: () => reasonRef.current?.focus() });

  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-center gap-2">
        <StatusBadge status={credential.state} />
        {!open && (
          <span className="text-sm text-ink-700">
            This document has been decided; nothing more to do here.
          </span>
        )}
      </div>
      <ReviewerWarnings warnings={credential.warnings} />
      {conflict ? (
        <p
          role="alert"
          className="rounded-md border-l-4 border-red-700 bg-red-50 px-4 py-3 text-sm font-semibold text-red-900"
        >
          {conflictWords}
        </p>
      ) : (
        <FormError error={summary} labels={labelsOf(definitions)} />
      )}
      <section aria-labelledby="fields-heading">
        <h2 id="fields-heading" className="mb-3 text-lg font-semibold text-ink-900">
          Fields
        </h2>
        <CredentialFieldsForm
          definitions={definitions}
          values={values}
          onChange={(path, value) => setValues((current) => ({ ...current, [path]: value }))}
          errors={problems}
          found={noFound}
          lowConfidence={doubtful}
          onFocusField={onFocusField}
          disabled={!open || busy}
        />
        {open && (
          <div className="mt-3 flex flex-wrap items-center gap-3">
            <Button
              variant="secondary"
              onClick={saveFields}
              disabled={!dirty}
              pending={save.isPending}
              pendingLabel="Saving…"
            >
              Save corrections
            </Button>
            {save.isSuccess && !dirty && (
              <span role="status" className="text-sm text-ink-700">
                Corrections saved.
              </span>
            )}
            {dirty && (
              <span className="text-sm text-ink-700">
                Unsaved corrections are saved with the verification.
              </span>
            )}
          </div>
        )}
      </section>
      {open && (
        <section
          aria-labelledby="decision-heading"
          className="space-y-4 rounded-lg border border-ink-100 bg-white p-4"
        >
          <h2 id="decision-heading" className="text-lg font-semibold text-ink-900">
            Decision
          </h2>
          <p className="text-sm text-ink-700">
            Keyboard: press <kbd className="rounded border border-ink-300 bg-ink-50 px-1 font-mono">V</kbd> to
            verify, <kbd className="rounded border border-ink-300 bg-ink-50 px-1 font-mono">R</kbd> to write a
            return reason. The keys do nothing while you type in a field.
          </p>
          <Button
            onClick={decideVerify}
            pending={verify.isPending}
            pendingLabel="Verifying…"
            disabled={busy}
            className="min-h-11"
          >
            Verify
          </Button>
          <ReturnReasonForm
            fieldSet={fieldSet}
            disabled={busy}
            pending={giveBack.isPending}
            reasonRef={reasonRef}
            onReturn={decideReturn}
          />
        </section>
      )}
    </div>
  );
}
