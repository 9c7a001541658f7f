import { useId, useState, type RefObject } from "react";
import type { FieldSet } from "@shared/credentials/credential-fields.ts";
import { returnReasonsFor } from "@shared/credentials/return-reasons.ts";
import { returnCredentialSchema } from "@shared/credentials/schemas.ts";
import { Button } from "@/components/ui/button.tsx";

type ReturnReasonFormProps = {
  fieldSet: FieldSet;
  disabled: boolean;
  pending: boolean;
  /** The reason box, so the review page's R key can put the cursor there. */
  reasonRef: RefObject<HTMLTextAreaElement | null>;
  onReturn: (reason: string) => void;
};

/** Sending a document back: a ready-made reason to start from, edited in the box, checked by the shared schema. */
export function ReturnReasonForm({
  fieldSet,
  disabled,
  pending,
  reasonRef,
  onReturn,
}: ReturnReasonFormProps) {
  const [reason, setReason] = useState("");
  const [problem, setProblem] = useState<string | null>(null);
  const readyId = useId();
  const reasons = returnReasonsFor(fieldSet);

  const send = () => {
    const parsed = returnCredentialSchema.safeParse({ reason });
    if (!parsed.success) {
      setProblem(parsed.error.issues[0]?.message ?? "Say what the uploader must fix");
      reasonRef.current?.focus();
      return;
    }
    setProblem(null);
    onReturn(parsed.data.reason);
  };

  return (
    <div className="space-y-1 border-t border-ink-100 pt-4">
      <label htmlFor={readyId} className="block text-sm font-medium text-ink-900">
        Start from a ready-made reason
      </label>
      <select
        id={readyId}
        value=""
        disabled={disabled}
        onChange={(event) => {
          const chosen = event.currentTarget.value;
          if (!chosen) return;
          setReason(chosen);
          setProblem(null);
          reasonRef.current?.focus();
        }}
        className="mb-3 block min-h-11 w-full rounded-md border border-ink-300 bg-white px-3 py-2 text-base text-ink-900 focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-ink-700"
      >
        <option value="">Choose one to fill the box below…</option>
        {reasons.map((r) => (
          <option key={r} value={r}>
            {r}
          </option>
        ))}
      </select>
      <label htmlFor="return-reason" className="block text-sm font-medium text-ink-900">
        Reason for returning
      </label>
      <p id="return-reason-hint" className="text-sm text-ink-700">
        The uploader sees this; say what to fix. A ready-made reason can be edited before sending.
      </p>
      <textarea
        id="return-reason"
        ref={reasonRef}
        value={reason}
        onChange={(event) => setReason(event.currentTarget.value)}
        rows={3}
        required
        aria-invalid={problem ? true : undefined}
        aria-describedby={["return-reason-hint", problem ? "return-reason-error" : ""]
          .filter(Boolean)
          .join(" ")}
        className={`block w-full rounded-md border bg-white px-3 py-2 text-base text-ink-900 focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-ink-700 ${
          problem ? "border-red-700" : "border-ink-300"
        }`}
      />
      {problem && (
        <p id="return-reason-error" className="text-sm font-medium text-red-800">
          {problem}
        </p>
      )}
      <Button
        variant="danger"
        onClick={send}
        pending={pending}
        pendingLabel="Returning…"
        disabled={disabled}
        className="mt-2"
      >
        Return to uploader
      </Button>
    </div>
  );
}
