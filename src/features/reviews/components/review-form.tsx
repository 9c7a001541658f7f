import { useState, type FormEvent } from "react";
import { MAX_STARS, MIN_STARS, writeReviewSchema, type WriteReview } from "@shared/reviews/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { TextAreaField } from "@/components/ui/text-area-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";

const starWords: Record<number, string> = { 1: "Poor", 2: "Fair", 3: "Good", 4: "Very good", 5: "Excellent" };
const stars = Array.from({ length: MAX_STARS - MIN_STARS + 1 }, (_, i) => MIN_STARS + i);
const labels = { stars: "Rating", body: "What went well, and what did not" };
const plainWords = { stars: "Choose from 1 to 5 stars" };

type ReviewFormProps = { pending: boolean; serverError: unknown; onSubmit: (input: WriteReview) => void };

/** 1 to 5 stars as labelled radio buttons (each says its number and word), and the text. */
export function ReviewForm({ pending, serverError, onSubmit }: ReviewFormProps) {
  const [invalid, setInvalid] = useState<unknown>(null);
  const problem = invalid ?? serverError;
  const errors = fieldErrorsOf(problem, plainWords);

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const chosen = data.get("stars");
    const parsed = writeReviewSchema.safeParse({
      stars: chosen === null ? undefined : Number(chosen),
      body: String(data.get("body") ?? ""),
    });
    if (!parsed.success) {
      setInvalid(parsed.error);
      return;
    }
    setInvalid(null);
    onSubmit(parsed.data);
  };

  return (
    <form noValidate onSubmit={submit} className="space-y-4" aria-label="Rate this job">
      <FormError error={problem} labels={labels} plainWords={plainWords} />
      <fieldset aria-describedby={errors.stars ? "review-stars-error" : undefined}>
        <legend className="mb-2 text-sm font-medium text-ink-900">{labels.stars}</legend>
        <div className="flex flex-wrap gap-2">
          {stars.map((n) => (
            <label
              key={n}
              className="flex min-h-11 cursor-pointer items-center gap-2 rounded-md border border-ink-300 bg-white px-3 has-checked:border-ink-700 has-checked:bg-ink-50 has-focus-visible:outline-2 has-focus-visible:outline-ink-700"
            >
              <input
                type="radio"
                name="stars"
                value={n}
                data-field={n === MIN_STARS ? "stars" : undefined}
                className="size-4 accent-ink-700"
              />
              <span className="text-sm text-ink-900">
                <span aria-hidden="true" className="text-accent-700">
                  {"★".repeat(n)}
                </span>{" "}
                {n} {n === 1 ? "star" : "stars"}, {starWords[n]}
              </span>
            </label>
          ))}
        </div>
        {errors.stars && (
          <p id="review-stars-error" className="mt-1 text-sm font-medium text-red-800">
            {errors.stars}
          </p>
        )}
      </fieldset>
      <TextAreaField label={labels.body} name="body" rows={4} error={errors.body} />
      <Button type="submit" pending={pending} pendingLabel="Sending">
        Send rating
      </Button>
    </form>
  );
}
