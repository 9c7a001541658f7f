import { useMemo } from "react";
import { useQuery, useSuspenseQuery } from "@tanstack/react-query";
import { useLocation, useSearchParams } from "react-router-dom";
import { queueQuerySchema, queueSortKeys, type QueueQuery } from "@shared/credentials/schemas.ts";
import { hrefs } from "@/config/paths.ts";
import { DataTable } from "@/components/ui/data-table.tsx";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { credentialTypesQuery } from "@/features/credentials/api/get-credential-types.ts";
import { reviewQueueQuery, useReviewQueue } from "@/features/credentials/api/get-review-queue.ts";
import { queueColumns } from "@/features/credentials/components/queue-columns.tsx";
import { QueueFilters, type QueueFilterValues } from "@/features/credentials/components/queue-filters.tsx";
import { QueuePagination } from "@/features/credentials/components/queue-pagination.tsx";
import { queryClient } from "@/lib/query-client.ts";

const PAGE_SIZE = 25;
// Enough rows to list the companies waiting in the queue for the company filter.
const companiesProbe = { pageSize: 100 } as const;

/** The queue's query from the URL; anything unreadable falls back to the default (oldest first, page 1). */
function queueQueryOf(search: URLSearchParams): Partial<QueueQuery> {
  const raw = Object.fromEntries([...search.entries()].filter(([, v]) => v !== ""));
  const parsed = queueQuerySchema.safeParse({ pageSize: PAGE_SIZE, ...raw });
  return parsed.success ? parsed.data : { sort: "submittedAt", dir: "asc", page: 1, pageSize: PAGE_SIZE };
}

export async function loader({ request }: { request: Request }) {
  const query = queueQueryOf(new URL(request.url).searchParams);
  await Promise.all([
    queryClient.ensureQueryData(reviewQueueQuery(query)),
    queryClient.ensureQueryData(credentialTypesQuery()),
  ]);
  return null;
}

const columns = queueColumns(hrefs.review);

export function Component() {
  const [search, setSearch] = useSearchParams();
  const query = queueQueryOf(search);
  const queue = useReviewQueue(query);
  const { data } = queue;
  const { data: types } = useSuspenseQuery(credentialTypesQuery());
  const probe = useQuery(reviewQueueQuery(companiesProbe));
  const arrival = useLocation().state as { decided?: string } | null;

  const companyOptions = useMemo(() => {
    const byId = new Map<number, string>();
    for (const row of [...(probe.data?.rows ?? []), ...(data?.rows ?? [])])
      byId.set(row.companyId, row.companyName);
    return [...byId]
      .map(([id, name]) => ({ value: String(id), label: name }))
      .sort((a, b) => a.label.localeCompare(b.label));
  }, [probe.data, data]);
  const typeOptions = types.map((t) => ({ value: t.code, label: t.name }));

  const update = (changes: Record<string, string | undefined>) => {
    const next = new URLSearchParams(search);
    for (const [key, value] of Object.entries(changes)) {
      if (value === undefined || value === "") next.delete(key);
      else next.set(key, value);
    }
    setSearch(next, { replace: true });
  };

  const filters: QueueFilterValues = {
    typeCode: search.get("typeCode") ?? "",
    companyId: search.get("companyId") ?? "",
    minWaitingHours: search.get("minWaitingHours") ?? "",
  };
  const sorting = [{ id: query.sort ?? "submittedAt", desc: query.dir === "desc" }];

  return (
    <>
      <PageHeader
        title="Verification queue"
        description="Documents waiting for a decision, oldest first. Open one to compare the document with its fields."
      />
      {arrival?.decided && (
        <p
          role="status"
          className="mb-4 rounded-md border-l-4 border-emerald-700 bg-emerald-50 px-4 py-3 text-sm text-ink-900"
        >
          {arrival.decided}
        </p>
      )}
      <QueueFilters
        values={filters}
        typeOptions={typeOptions}
        companyOptions={companyOptions}
        onChange={(values) => update({ ...values, page: undefined })}
      />
      {queue.isError && <FormError error={queue.error} />}
      <DataTable
        caption={
          queue.isError
            ? "Verification queue: could not be loaded"
            : `Verification queue: ${data?.total ?? 0} waiting`
        }
        columns={columns}
        data={data?.rows ?? []}
        getRowId={(row) => String(row.id)}
        empty={
          queue.isError ? (
            <EmptyState title="The queue could not be loaded">
              Nothing is shown because the request failed, not because the queue is empty. Reload the page to
              try again.
            </EmptyState>
          ) : queue.isPending ? (
            <EmptyState title="Loading the queue">
              The documents waiting for a decision appear here.
            </EmptyState>
          ) : (
            <EmptyState title="Nothing is waiting">No document matches these filters.</EmptyState>
          )
        }
        serverSorting={{
          sorting,
          onSortingChange: (next) => {
            const first = next[0];
            const sort =
              first && (queueSortKeys as readonly string[]).includes(first.id) ? first.id : undefined;
            update({ sort, dir: sort && first?.desc ? "desc" : undefined, page: undefined });
          },
        }}
      />
      {data && data.total > 0 && (
        <QueuePagination
          page={data.page}
          pageSize={data.pageSize}
          total={data.total}
          onPage={(page) => update({ page: page === 1 ? undefined : String(page) })}
        />
      )}
    </>
  );
}
