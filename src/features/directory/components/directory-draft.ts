import { DEFAULT_ON_SITE_HOURS } from "@shared/directory/call-out-estimate.ts";
/** The filter form as it is being edited; every value is the text of its URL parameter. */
export type DirectoryDraft = {
  siteId: string;
  radiusMiles: string;
  equipmentId: string;
  credentialTypes: string[];
  oemBuilder: string;
  controlFamily: string;
  minOemLevel: string;
  technology: string;
  minEachOccurrence: string;
  minAggregate: string;
  minAutoCsl: string;
  requirementSetId: string;
  minRating: string;
  q: string;
  onSiteHours: string;
};

const textKeys = [
  "siteId",
  "radiusMiles",
  "equipmentId",
  "oemBuilder",
  "controlFamily",
  "minOemLevel",
  "technology",
  "minEachOccurrence",
  "minAggregate",
  "minAutoCsl",
  "requirementSetId",
  "minRating",
  "q",
  "onSiteHours",
] as const;

const moneyKeys = new Set<string>(["minEachOccurrence", "minAggregate", "minAutoCsl"]);

export function draftFromSearch(search: URLSearchParams): DirectoryDraft {
  const draft = {
    credentialTypes: (search.get("credentialTypes") ?? "").split(",").filter(Boolean),
  } as DirectoryDraft;
  for (const key of textKeys) draft[key] = search.get(key) ?? "";
  return draft;
}

/** Only the filters that are set go into the URL, in a fixed order, so equal searches share one bookmark and one cache entry. */
export function searchFromDraft(draft: DirectoryDraft, sort: string): URLSearchParams {
  const search = new URLSearchParams();
  for (const key of textKeys) {
    // People type limits as printed on certificates ("$1,000,000"); the URL carries plain numbers.
    const value = (moneyKeys.has(key) ? draft[key].replace(/[$,\s]/g, "") : draft[key]).trim();
    if (value) search.set(key, value);
  }
  if (draft.credentialTypes.length > 0)
    search.set("credentialTypes", [...draft.credentialTypes].sort().join(","));
  if (sort) search.set("sort", sort);
  return search;
}

export const onSiteHoursOf = (draft: Pick<DirectoryDraft, "onSiteHours">): number => {
  const hours = Number(draft.onSiteHours);
  return draft.onSiteHours !== "" && Number.isFinite(hours) && hours >= 0 ? hours : DEFAULT_ON_SITE_HOURS;
};

/** Filters the applied search narrows by (each ticked credential type counts); the estimate's hours are not a filter. */
export function activeFilterCount(draft: DirectoryDraft): number {
  const set = textKeys.filter((key) => key !== "onSiteHours" && draft[key].trim() !== "").length;
  return set + draft.credentialTypes.length;
}
