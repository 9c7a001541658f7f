export const directoryKeys = {
  all: ["directory"] as const,
  /** `search` is the normalised query string (without the cursor), so a bookmarked URL reuses the cache. */
  search: (search: string) => [...directoryKeys.all, "search", search] as const,
  technician: (id: number, onSiteHours: number, siteId: number | null) =>
    [...directoryKeys.all, "technician", id, onSiteHours, siteId] as const,
};
