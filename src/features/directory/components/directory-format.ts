import type { DirectoryFilterName } from "@shared/directory/schemas.ts";

/** "1 h 25 min", "40 min": a drive time as people say it. */
export function formatDriveTime(hours: number): string {
  const minutes = Math.max(1, Math.round(hours * 60));
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  return h === 0 ? `${m} min` : m === 0 ? `${h} h` : `${h} h ${m} min`;
}

/** "4.7 (12)" or "No ratings yet": an average is never shown without its count. */
export const ratingWords = (rating: { average: number | null; count: number }): string =>
  rating.average === null || rating.count === 0
    ? "No ratings yet"
    : `${rating.average.toFixed(1)} (${rating.count})`;

/** How the empty state names the filter that removed the most candidates. */
export const filterWords: Record<DirectoryFilterName, string> = {
  credentialTypes: "the credential types",
  oemTraining: "the machine builder training (builder, control family, level)",
  technology: "the machine technology",
  generalLiability: "the general liability limits",
  autoLiability: "the auto liability limit",
  requirementSetId: "the requirement set",
  distance: "the distance from the site (your radius and each technician's own service radius)",
  minRating: "the minimum rating",
  q: "the name search",
};
