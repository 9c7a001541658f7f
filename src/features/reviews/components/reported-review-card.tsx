import { formatDateTime } from "@/lib/format-date-time.ts";
import type { ReportedReview } from "../api/get-reported-reviews.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { useKeepReview } from "../api/keep-review.ts";
import { ExcludeReviewForm } from "./exclude-review-form.tsx";

const MAX_STARS = 5;

const SIGNAL_WORDS: Record<ReportedReview["selfRatingSignals"][number], string> = {
  email_domain: "an e-mail domain",
  phone: "a phone number",
  address: "a street address",
};

/** One review for the admin: the rating, the reply, who reported it and why, and any sign of self-rating. */
export function ReportedReviewCard({ review }: { review: ReportedReview }) {
  const headingId = `reported-review-${review.id}`;
  return (
    <article aria-labelledby={headingId} className="space-y-3 rounded-lg border border-ink-100 bg-white p-4">
      <header className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id={headingId} className="font-semibold text-ink-900">
          {review.technicianName || `Technician ${review.technicianId}`}{" "}
          <span className="font-normal text-ink-700">· work order #{review.workOrderId}</span>
        </h2>
        <p className="text-ink-900">
          <span aria-hidden="true" className="text-accent-700">
            {"★".repeat(review.stars)}
            {"☆".repeat(MAX_STARS - review.stars)}
          </span>{" "}
          <span className="font-semibold">
            {review.stars} out of {MAX_STARS}
          </span>
        </p>
      </header>
      <div>
        <p className="text-sm text-ink-700">
          By {review.authorName}, {review.shopName} ·{" "}
          <time dateTime={review.createdAt}>{formatDateTime(review.createdAt)}</time>
        </p>
        <p className="mt-1 whitespace-pre-line text-ink-900">{review.body}</p>
      </div>
      {review.reply ? (
        <div className="border-l-4 border-ink-300 pl-3">
          <p className="text-sm font-semibold text-ink-900">
            Reply from the service company
            {review.repliedAt && (
              <span className="font-normal text-ink-700">
                {" "}
                · <time dateTime={review.repliedAt}>{formatDateTime(review.repliedAt)}</time>
              </span>
            )}
          </p>
          <p className="whitespace-pre-line text-ink-900">{review.reply}</p>
        </div>
      ) : (
        <p className="text-sm text-ink-700">No reply from the service company.</p>
      )}
      {review.reportedAt && (
        <div className="rounded-md border-l-4 border-red-700 bg-red-50 px-3 py-2">
          <p className="text-sm font-semibold text-red-900">
            Reported by {review.reportedBy.name || `user ${review.reportedBy.id}`} ·{" "}
            <time dateTime={review.reportedAt}>{formatDateTime(review.reportedAt)}</time>
          </p>
          <p className="whitespace-pre-line text-sm text-ink-900">{review.reportReason}</p>
        </div>
      )}
      {review.selfRatingSignals.length > 0 && (
        <div className="space-y-2 rounded-md border-l-4 border-amber-700 bg-amber-50 px-3 py-2">
          <p className="text-sm font-semibold text-ink-900">
            Possible self-rating: the shop and the service company share{" "}
            {review.selfRatingSignals.map((s) => SIGNAL_WORDS[s]).join(", ")}.
          </p>
        </div>
      )}
      <ReviewDecision review={review} />
    </article>
  );
}

/** Keep it counted, or leave it out of the score with a reason; either way the review stays on the record. */
function ReviewDecision({ review }: { review: ReportedReview }) {
  const keep = useKeepReview();
  if (review.excluded)
    return (
      <p className="text-sm text-ink-900">
        <span aria-hidden="true">✕ </span>
        <span className="font-semibold">Left out of the score</span> by {review.excluded.by || "an admin"} ·{" "}
        <time dateTime={review.excluded.at}>{formatDateTime(review.excluded.at)}</time>:{" "}
        {review.excluded.reason}
      </p>
    );
  return (
    <div className="space-y-3 border-t border-ink-100 pt-3">
      {review.kept ? (
        <p className="text-sm text-ink-900">
          <span aria-hidden="true">✓ </span>
          <span className="font-semibold">Kept in the score</span> by {review.kept.by || "an admin"} ·{" "}
          <time dateTime={review.kept.at}>{formatDateTime(review.kept.at)}</time>
        </p>
      ) : (
        <div className="space-y-1">
          <FormError error={keep.error} />
          <Button
            variant="secondary"
            pending={keep.isPending}
            pendingLabel="Saving"
            onClick={() => keep.mutate(review.id)}
          >
            Keep in the score
          </Button>
        </div>
      )}
      <ExcludeReviewForm reviewId={review.id} />
    </div>
  );
}
