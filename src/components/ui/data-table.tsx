import type { ReactNode } from "react";
import {
  createColumnHelper,
  createSortedRowModel,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  sortFn_datetime,
  sortFn_text,
  tableFeatures,
  useTable,
  type ColumnDef,
  type RowData,
  type SortingState,
} from "@tanstack/react-table";

// Features live at module scope: a new object each render would rebuild the row models.
export const dataTableFeatures = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: {
    alphanumeric: sortFn_alphanumeric,
    text: sortFn_text,
    datetime: sortFn_datetime,
    basic: sortFn_basic,
  },
});
export type DataTableFeatures = typeof dataTableFeatures;

/** Column helper for a row type, bound to the table's features. */
export const dataTableColumns = <Row extends RowData>() => createColumnHelper<DataTableFeatures, Row>();

type DataTableProps<Row extends RowData> = {
  /** Must be stable (module scope or useMemo). `any` for the value type: each column has its own. */
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  columns: Array<ColumnDef<DataTableFeatures, Row, any>>;
  data: Row[];
  /** Names the table for assistive technology; shown as a small heading unless hidden. */
  caption: string;
  hideCaption?: boolean;
  initialSorting?: SortingState;
  getRowId?: (row: Row) => string;
  /** Shown instead of the table when there are no rows. */
  empty?: ReactNode;
  /** Marks a row as chosen (e.g. the mail being read). */
  isRowSelected?: (row: Row) => boolean;
  /**
   * Server-side sorting: the page owns the sort (e.g. in the URL) and fetches rows already in that order.
   * Rows are then shown as given.
   */
  serverSorting?: { sorting: SortingState; onSortingChange: (sorting: SortingState) => void };
};

const ariaSort = (sorted: false | "asc" | "desc") =>
  sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined;

function SortMark({ sorted }: { sorted: false | "asc" | "desc" }) {
  return (
    <svg viewBox="0 0 10 12" className="size-2.5 shrink-0" aria-hidden="true" focusable="false">
      <path d="M5 1 9 5H1z" className={sorted === "asc" ? "fill-ink-900" : "fill-ink-300"} />
      <path d="M5 11 1 7h8z" className={sorted === "desc" ? "fill-ink-900" : "fill-ink-300"} />
    </svg>
  );
}

/** A dense, calm table with sortable headers; headers are buttons and carry aria-sort. */
export function DataTable<Row extends RowData>({
  columns,
  data,
  caption,
  hideCaption = false,
  initialSorting = [],
  getRowId,
  empty,
  isRowSelected,
  serverSorting,
}: DataTableProps<Row>) {
  const table = useTable({
    features: dataTableFeatures,
    columns,
    data,
    initialState: { sorting: initialSorting },
    ...(getRowId ? { getRowId: (row: Row) => getRowId(row) } : {}),
    ...(serverSorting
      ? {
          manualSorting: true,
          state: { sorting: serverSorting.sorting },
          onSortingChange: (updater: SortingState | ((old: SortingState) => SortingState)) =>
            serverSorting.onSortingChange(
              typeof updater === "function" ? updater(serverSorting.sorting) : updater,
            ),
        }
      : {}),
  });

  if (data.length === 0 && empty) return <>{empty}</>;

  return (
    // `relative`: screen-reader-only text in cells is positioned absolutely and would otherwise escape the
    // scrolling box and widen the whole page on phones.
    <div className="relative overflow-x-auto rounded-lg border border-ink-100 bg-white">
      <table className="w-full border-collapse text-left text-sm">
        <caption
          className={
            hideCaption
              ? "sr-only"
              : "border-b border-ink-100 px-3 py-2 text-left text-sm font-semibold text-ink-900"
          }
        >
          {caption}
        </caption>
        <thead className="bg-ink-50 text-ink-800">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={ariaSort(sorted)}
                    className="border-b border-ink-100 px-3 py-2 font-semibold whitespace-nowrap"
                  >
                    {header.isPlaceholder ? null : header.column.getCanSort() ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className="-mx-1 inline-flex items-center gap-1.5 rounded px-1 hover:text-ink-900 focus-visible:outline-2 focus-visible:outline-ink-700"
                      >
                        <table.FlexRender header={header} />
                        <SortMark sorted={sorted} />
                      </button>
                    ) : (
                      <table.FlexRender header={header} />
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr
              key={row.id}
              data-selected={isRowSelected?.(row.original) || undefined}
              className="border-b border-ink-100 last:border-b-0 hover:bg-ink-50/60 data-selected:bg-ink-100"
            >
              {row.getAllCells().map((cell) => (
                <td key={cell.id} className="px-3 py-2 align-top text-ink-900">
                  <table.FlexRender cell={cell} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
