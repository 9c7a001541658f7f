import type { RatingSummaryDto as Rating } from "@shared/directory/directory-shapes.ts";
import { ratingWords } from "./directory-format.ts";

/** "4.7 (12)" with a star, or "No ratings yet"; the count is always there, and screen readers hear it in words. */
export function RatingSummary({ rating }: { rating: Rating }) {
  if (rating.average === null || rating.count === 0)
    return <span className="text-sm text-ink-700">No ratings yet</span>;
  return (
    <span className="inline-flex items-center gap-1 whitespace-nowrap text-sm text-ink-900">
      <span aria-hidden="true" className="text-accent-700">
        ★
      </span>
      <span aria-hidden="true">{ratingWords(rating)}</span>
      <span className="sr-only">
        Rated {rating.average.toFixed(1)} out of 5 from {rating.count} {rating.count === 1 ? "job" : "jobs"}
      </span>
    </span>
  );
}
