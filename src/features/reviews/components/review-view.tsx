import { useState } from "react";
import { replyToReviewSchema, reportReviewSchema } from "@shared/reviews/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { formatDateTime } from "@/lib/format-date-time.ts";
import { useReplyToReview } from "../api/reply-to-review.ts";
import { useReportReview } from "../api/report-review.ts";
import type { ReviewDto as Review } from "@shared/reviews/schemas.ts";
import { ShortTextForm } from "./short-text-form.tsx";

type ReviewViewProps = {
  review: Review;
  /** The rated technician's company admin may answer once. */
  canReply: boolean;
};

/** A job's rating, the service company's reply, and a way for either side to report it to the platform. */
export function ReviewView({ review, canReply }: ReviewViewProps) {
  const reply = useReplyToReview();
  const report = useReportReview();
  const [reporting, setReporting] = useState(false);
  return (
    <div className="space-y-3">
      <p className="text-ink-900">
        <span aria-hidden="true" className="text-accent-700">
          {"★".repeat(review.stars)}
          {"☆".repeat(5 - review.stars)}
        </span>{" "}
        <span className="font-semibold">{review.stars} out of 5</span>{" "}
        <span className="text-sm text-ink-700">
          by {review.authorName}, {review.shopName} · {formatDateTime(review.createdAt)}
        </span>
      </p>
      <p className="whitespace-pre-line text-ink-900">{review.body}</p>
      {review.reply ? (
        <div className="border-l-4 border-ink-300 pl-3">
          <p className="text-sm font-semibold text-ink-900">Reply from the service company</p>
          <p className="whitespace-pre-line text-ink-900">{review.reply}</p>
        </div>
      ) : (
        canReply && (
          <ShortTextForm
            name="body"
            label="Your reply (one reply, shown with the rating)"
            submitLabel="Send reply"
            schema={replyToReviewSchema}
            pending={reply.isPending}
            serverError={reply.error}
            onSubmit={({ body }) => reply.mutate({ reviewId: review.id, body })}
          />
        )
      )}
      {review.reported ? (
        <p className="text-sm text-ink-700">Reported to the platform for a look.</p>
      ) : reporting ? (
        <ShortTextForm
          name="reason"
          label="What is wrong with this rating?"
          submitLabel="Send report"
          schema={reportReviewSchema}
          pending={report.isPending}
          serverError={report.error}
          onSubmit={({ reason }) =>
            report.mutate({ reviewId: review.id, reason }, { onSuccess: () => setReporting(false) })
          }
          onCancel={() => setReporting(false)}
        />
      ) : (
        <Button variant="quiet" onClick={() => setReporting(true)}>
          Report
        </Button>
      )}
    </div>
  );
}
