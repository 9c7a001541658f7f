import { Button } from "@/components/ui/button.tsx";

type QueuePaginationProps = { page: number; pageSize: number; total: number; onPage: (page: number) => void };

export function QueuePagination({ page, pageSize, total, onPage }: QueuePaginationProps) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  return (
    <nav
      aria-label="Queue pages"
      className="mt-3 flex flex-wrap items-center justify-between gap-3 text-sm text-ink-700"
    >
      <p>
        {first}–{last} of {total} · page {page} of {pages}
      </p>
      <div className="flex gap-2">
        <Button variant="secondary" disabled={page <= 1} onClick={() => onPage(page - 1)}>
          Previous page
        </Button>
        <Button variant="secondary" disabled={page >= pages} onClick={() => onPage(page + 1)}>
          Next page
        </Button>
      </div>
    </nav>
  );
}
