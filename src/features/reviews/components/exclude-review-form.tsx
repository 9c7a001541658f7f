import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { TextAreaField } from "@/components/ui/text-area-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { useExcludeReview } from "../api/exclude-review.ts";

/** The admin's decision on a flagged review: leave it out of the score, saying why (the review stays listed). */
export function ExcludeReviewForm({ reviewId }: { reviewId: number }) {
  const [reason, setReason] = useState("");
  const exclude = useExcludeReview();
  const send = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    exclude.mutate({ reviewId, reason });
  };
  return (
    <form noValidate onSubmit={send} className="space-y-2" aria-label="Leave out of the score">
      <FormError error={exclude.error} labels={{ reason: "Reason" }} />
      <TextAreaField
        label="Reason for leaving it out of the score"
        name={`exclude-reason-${reviewId}`}
        rows={2}
        value={reason}
        onChange={(event) => setReason(event.currentTarget.value)}
        error={fieldErrorsOf(exclude.error).reason}
        hint="The review stays on the technician's record; only its stars stop counting."
      />
      <Button type="submit" variant="secondary" pending={exclude.isPending} pendingLabel="Saving">
        Leave out of the score
      </Button>
    </form>
  );
}
