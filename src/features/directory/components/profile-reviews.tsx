import { formatInstantDate } from "@/lib/format-date.ts";
import type { DirectoryTechnicianDto as DirectoryTechnician } from "@shared/directory/directory-shapes.ts";
import { RatingSummary } from "./rating-summary.tsx";

/** The rating with its count, then each review with the service company's reply. */
export function ProfileReviews({ technician }: { technician: DirectoryTechnician }) {
  return (
    <div className="space-y-3">
      <p className="flex flex-wrap items-center gap-2">
        <RatingSummary rating={technician.rating} />
        <span className="text-xs text-ink-700">
          Only from work orders completed and confirmed through Clearbench.
        </span>
      </p>
      {technician.reviews.length > 0 && (
        <ul className="space-y-3">
          {technician.reviews.map((r) => (
            <li key={r.id} className="rounded-lg border border-ink-100 bg-white p-4">
              <p className="text-sm text-ink-900">
                <span aria-hidden="true" className="text-accent-700">
                  {"★".repeat(r.stars)}
                  {"☆".repeat(5 - r.stars)}
                </span>{" "}
                <span className="font-semibold">{r.stars} out of 5</span>
                {r.createdAt && <span className="text-ink-700"> · {formatInstantDate(r.createdAt)}</span>}
              </p>
              {r.text && <p className="mt-1 whitespace-pre-line text-ink-900">{r.text}</p>}
              {r.reply && (
                <div className="mt-2 border-l-4 border-ink-300 pl-3 text-sm">
                  <p className="font-semibold text-ink-900">Reply from {technician.companyName}</p>
                  <p className="whitespace-pre-line text-ink-900">{r.reply}</p>
                </div>
              )}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
