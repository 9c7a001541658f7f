import { useSuspenseQuery } from "@tanstack/react-query";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { reportedReviewsQuery } from "@/features/reviews/api/get-reported-reviews.ts";
import { ReportedReviewCard } from "@/features/reviews/components/reported-review-card.tsx";
import { queryClient } from "@/lib/query-client.ts";

export async function loader() {
  await queryClient.ensureQueryData(reportedReviewsQuery());
  return null;
}

export function Component() {
  const { data: reviews } = useSuspenseQuery(reportedReviewsQuery());
  return (
    <>
      <PageHeader
        title="Reported ratings"
        description="Ratings a shop or a service company has reported, oldest report first, then ratings where the shop and the rated company share an e-mail domain, phone number or address."
      />
      <p className="mb-4 rounded-md border border-ink-100 bg-ink-50 px-4 py-3 text-sm text-ink-900">
        <span className="font-semibold">Reviews are never deleted,</span> so there is no delete button here. A
        rating is part of a technician&apos;s record of confirmed work; read the report and take it up with
        the shop or the service company directly. Keep a reported rating in the score, or leave it out of the
        score with a reason; either way it stays on the record.
      </p>
      {reviews.length === 0 ? (
        <EmptyState title="No reported ratings">
          Ratings that someone reports, or that look like self-rating, appear here.
        </EmptyState>
      ) : (
        <ul className="space-y-4">
          {reviews.map((review) => (
            <li key={review.id}>
              <ReportedReviewCard review={review} />
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
