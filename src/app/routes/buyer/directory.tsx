import { useState } from "react";
import { useSuspenseQuery } from "@tanstack/react-query";
import { Link, redirect, useSearchParams, type LoaderFunctionArgs } from "react-router-dom";
import { directoryQuerySchema, directorySorts, type DirectorySort } from "@shared/directory/schemas.ts";
import { CLEARED_MEANS } from "@shared/safety/cautions.ts";
import { technologyLabels, type MachineTechnology } from "@shared/technicians/schemas.ts";
import { paths } from "@/config/paths.ts";
import { Button } from "@/components/ui/button.tsx";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { StatusKey } from "@/components/ui/status-key.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { Spinner } from "@/components/ui/spinner.tsx";
import { credentialTypesQuery } from "@/features/credentials/api/get-credential-types.ts";
import { directorySearchQuery, useDirectorySearch } from "@/features/directory/api/search-directory.ts";
import { filterWords } from "@/features/directory/components/directory-format.ts";
import {
  activeFilterCount,
  draftFromSearch,
  onSiteHoursOf,
  searchFromDraft,
  type DirectoryDraft,
} from "@/features/directory/components/directory-draft.ts";
import { DirectoryFilters } from "@/features/directory/components/directory-filters.tsx";
import { DirectoryResultCards } from "@/features/directory/components/directory-result-cards.tsx";
import { DirectoryResultsTable } from "@/features/directory/components/directory-results-table.tsx";
import { requirementSetsQuery } from "@/features/standing/api/get-requirement-sets.ts";
import { useSiteEquipment } from "@/features/sites/api/get-site-equipment.ts";
import { sitesQuery } from "@/features/sites/api/get-sites.ts";
import { queryClient } from "@/lib/query-client.ts";

const sortLabels: Record<DirectorySort, string> = {
  score: "Rating (ranked)",
  distance: "Distance",
  hourlyRate: "Hourly rate",
  soonestLapse: "Next lapse",
};

/** The URL's filters in their one normal form (no cursor): the cache key and the API's query string. */
const normalSearch = (params: URLSearchParams) =>
  searchFromDraft(draftFromSearch(params), params.get("sort") ?? "").toString();

/** Set when the buyer asked for every location, so an empty search is not sent back to the default site. */
const EVERYWHERE = "everywhere";

/**
 * The site a buyer decides for when they name none: the first site with its own requirement set, else their only
 * site. Opening the directory plainly starts there, so the first search already applies the site's rules.
 */
function defaultSiteId(
  sites: readonly { id: number; active: boolean }[],
  sets: readonly { siteId: number | null; active: boolean }[],
): number | null {
  const open = sites.filter((s) => s.active);
  const ruled = open.find((site) => sets.some((set) => set.active && set.siteId === site.id));
  return ruled?.id ?? (open.length === 1 ? open[0]!.id : null);
}

export async function loader({ request }: LoaderFunctionArgs) {
  const url = new URL(request.url);
  if (url.search === "") {
    const [sites, sets] = await Promise.all([
      queryClient.ensureQueryData(sitesQuery()),
      queryClient.ensureQueryData(requirementSetsQuery()),
    ]);
    const siteId = defaultSiteId(sites, sets);
    if (siteId !== null) return redirect(`${url.pathname}?siteId=${siteId}`);
  }
  const search = normalSearch(url.searchParams);
  await Promise.all([
    queryClient.ensureQueryData(sitesQuery()),
    queryClient.ensureQueryData(requirementSetsQuery()),
    queryClient.ensureQueryData(credentialTypesQuery()),
    // A bad bookmark should still open the page, with the problem shown beside the filters.
    queryClient.prefetchInfiniteQuery(directorySearchQuery(search)),
  ]);
  return null;
}

function Results({
  search,
  onSiteHours,
  siteName,
}: {
  search: string;
  onSiteHours: number;
  siteName: string | null;
}) {
  const results = useDirectorySearch(search);
  if (results.isPending) return <Spinner label="Searching" />;
  if (results.isError) return <FormError error={results.error} />;
  const rows = results.data.pages.flatMap((p) => p.rows);
  const first = results.data.pages[0]!;
  if (rows.length === 0)
    return (
      <EmptyState title="No cleared technician matches these filters">
        {first.emptyReason
          ? `Most candidates were removed by ${filterWords[first.emptyReason.filter]} (${first.emptyReason.removed} ${
              first.emptyReason.removed === 1 ? "technician" : "technicians"
            }). Loosen that filter first.`
          : "Only technicians who are cleared today are listed. Try fewer filters."}
      </EmptyState>
    );
  return (
    <div className="space-y-3" aria-busy={results.isFetching || undefined}>
      <p className="text-sm text-ink-700" role="status">
        Showing {rows.length} cleared {rows.length === 1 ? "technician" : "technicians"}
        {results.hasNextPage ? "; more below" : ""}. Distances are straight lines; drive times assume{" "}
        {first.assumptions.averageSpeedMph} mph on roads{" "}
        {Math.round((first.assumptions.roadFactor - 1) * 100)}% longer than the straight line.
      </p>
      <p className="text-sm font-medium text-ink-900" data-testid="directory-judged-against">
        {first.judgedAgainst.kind === "requirement_set"
          ? `Judged against ${first.judgedAgainst.name}${first.judgedAgainst.fromSite ? ", this site's requirement set" : ""}.`
          : "Judged against the platform baseline only: the company's insurance is in force; no card the technician holds was checked. Choose a site or a requirement set to apply your rules."}
      </p>
      <div className="hidden md:block">
        <DirectoryResultsTable
          rows={rows}
          onSiteHours={onSiteHours}
          siteName={siteName}
          judgedAgainst={first.judgedAgainst}
        />
      </div>
      <div className="md:hidden">
        <DirectoryResultCards
          rows={rows}
          onSiteHours={onSiteHours}
          siteName={siteName}
          judgedAgainst={first.judgedAgainst}
        />
      </div>
      {results.hasNextPage && (
        <Button
          variant="secondary"
          className="w-full sm:w-auto"
          pending={results.isFetchingNextPage}
          pendingLabel="Loading more"
          onClick={() => void results.fetchNextPage()}
        >
          Load more
        </Button>
      )}
    </div>
  );
}

function Search({ params }: { params: URLSearchParams }) {
  const [, setSearchParams] = useSearchParams();
  const { data: sites } = useSuspenseQuery(sitesQuery());
  const { data: sets } = useSuspenseQuery(requirementSetsQuery());
  const { data: types } = useSuspenseQuery(credentialTypesQuery());
  const [draft, setDraft] = useState<DirectoryDraft>(() => draftFromSearch(params));
  const [invalid, setInvalid] = useState<unknown>(null);
  const equipment = useSiteEquipment(draft.siteId ? Number(draft.siteId) : null);
  const sort = params.get("sort") ?? "";
  const search = normalSearch(params);

  const apply = (next: DirectoryDraft, nextSort: string) => {
    const query = searchFromDraft(next, nextSort);
    const parsed = directoryQuerySchema.safeParse(Object.fromEntries(query));
    if (!parsed.success) {
      setInvalid(parsed.error);
      return false;
    }
    setInvalid(null);
    setSearchParams(query.size === 0 ? new URLSearchParams({ [EVERYWHERE]: "1" }) : query);
    return true;
  };

  return (
    <div className="space-y-5">
      <DirectoryFilters
        draft={draft}
        onChange={setDraft}
        onSubmit={() => apply(draft, sort)}
        onClear={() => setSearchParams(new URLSearchParams({ [EVERYWHERE]: "1" }))}
        sites={sites.map((s) => ({ value: String(s.id), label: s.name }))}
        machines={(equipment.data ?? []).map((m) => ({
          id: m.id,
          label: `${m.builder} ${m.model} (${technologyLabels[m.technology as MachineTechnology] ?? m.technology}, ${m.controlFamily})`,
          technology: m.technology,
          controlFamily: m.controlFamily,
          builder: m.builder,
        }))}
        requirementSets={sets.map((s) => ({ value: String(s.id), label: s.name }))}
        credentialTypes={types.filter((t) => t.active).map((t) => ({ code: t.code, name: t.name }))}
        error={invalid}
        activeCount={activeFilterCount(draftFromSearch(params))}
      />
      {sites.length === 0 && (
        <p className="text-sm text-ink-700">
          Add a site on the{" "}
          <Link to={paths.buyer.sites} className="underline underline-offset-2">
            Sites
          </Link>{" "}
          page to see distances, drive times and service call estimates.
        </p>
      )}
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h2 className="text-lg font-semibold text-ink-900">Results</h2>
        <SelectField
          label="Sort by"
          name="sort"
          className="w-56"
          options={directorySorts
            .filter((s) => s !== "distance" || params.get("siteId"))
            .map((s) => ({ value: s, label: sortLabels[s] }))}
          value={sort || (params.get("siteId") ? "distance" : "score")}
          onChange={(e) => apply(draftFromSearch(params), e.target.value)}
        />
      </div>
      <p className="text-sm text-ink-800">{CLEARED_MEANS}</p>
      <Results
        search={search}
        onSiteHours={onSiteHoursOf(draftFromSearch(params))}
        siteName={sites.find((s) => String(s.id) === params.get("siteId"))?.name ?? null}
      />
      <StatusKey statuses={["cleared", "lapsing"]} />
    </div>
  );
}

export function Component() {
  const [params] = useSearchParams();
  return (
    <>
      <PageHeader
        title="Directory"
        description="Technicians who are cleared today, near your sites. Filter by credential, machine builder training, technology, insurance limits, distance and rating; the filters stay in the address, so a search can be bookmarked."
      />
      {/* A new URL (back, a bookmark) starts a fresh draft from it. */}
      <Search key={normalSearch(params)} params={params} />
    </>
  );
}
