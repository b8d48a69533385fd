import "./column-meta";
import type { ReactNode } from "react";
import {
  flexRender,
  getCoreRowModel,
  useReactTable,
  type ColumnDef,
  type OnChangeFn,
  type SortingState,
} from "@tanstack/react-table";
import { ArrowDown, ArrowUp, ArrowUpDown } from "lucide-react";
import { cn } from "@/utils/cn";
import { DataTablePagination, type DataTablePaginationProps } from "./data-table-pagination";

type DataTableProps<TData> = {
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- columns differ in value type; TanStack Table types a mixed list this way
  columns: ColumnDef<TData, any>[];
  data: TData[];
  /** The table's accessible name (also its caption for screen readers). */
  label: string;
  getRowId?: (row: TData) => string;
  /** Server-side sorting: the state comes from the URL and changes go back to it. */
  sorting?: SortingState;
  onSortingChange?: OnChangeFn<SortingState>;
  pagination?: DataTablePaginationProps;
  /** True while a new page/sort is loading; the old rows stay, dimmed. */
  isFetching?: boolean;
  /** Shown instead of rows when there are none. */
  empty?: ReactNode;
  /** Below this width the table scrolls sideways instead of squeezing (e.g. "min-w-[40rem]"). */
  minWidthClassName?: string;
};

const ARIA_SORT = { asc: "ascending", desc: "descending" } as const;

/** A table whose sorting and paging are done by the server (manualSorting / manualPagination). */
export function DataTable<TData>({
  columns,
  data,
  label,
  getRowId,
  sorting = [],
  onSortingChange,
  pagination,
  isFetching = false,
  empty,
  minWidthClassName = "min-w-[36rem]",
}: DataTableProps<TData>) {
  const table = useReactTable({
    data,
    columns,
    getRowId,
    state: {
      sorting,
      ...(pagination ? { pagination: { pageIndex: pagination.page - 1, pageSize: pagination.pageSize } } : {}),
    },
    onSortingChange,
    manualSorting: true,
    manualPagination: true,
    rowCount: pagination?.total,
    enableSortingRemoval: true,
    enableMultiSort: false,
    getCoreRowModel: getCoreRowModel(),
  });

  const rows = table.getRowModel().rows;

  return (
    <div className="overflow-hidden rounded-xl border border-primer-200 bg-white shadow-card">
      <div className="scrollbar-thin relative overflow-x-auto">
        <table aria-label={label} aria-busy={isFetching || undefined} className={cn("w-full border-collapse text-left text-sm", minWidthClassName)}>
          <thead className="bg-primer-100 text-ink-900">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const canSort = header.column.getCanSort() && !!onSortingChange;
                  const content = header.isPlaceholder ? null : flexRender(header.column.columnDef.header, header.getContext());
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={sorted ? ARIA_SORT[sorted] : canSort ? "none" : undefined}
                      className={cn("border-b border-primer-200 px-2 py-2 font-semibold whitespace-nowrap sm:px-3", header.column.columnDef.meta?.className)}
                    >
                      {canSort ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className={cn(
                            "-mx-2 inline-flex min-h-10 items-center gap-1.5 rounded-md px-2 hover:bg-primer-200",
                            sorted && "text-candy-800",
                          )}
                        >
                          {content}
                          {sorted === "asc" ? (
                            <ArrowUp aria-hidden className="size-4" />
                          ) : sorted === "desc" ? (
                            <ArrowDown aria-hidden className="size-4" />
                          ) : (
                            <ArrowUpDown aria-hidden className="size-4 text-primer-500" />
                          )}
                        </button>
                      ) : (
                        content
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className={cn("transition-opacity", isFetching && "opacity-60")}>
            {rows.length === 0 ? (
              <tr>
                <td colSpan={table.getVisibleLeafColumns().length} className="p-4">
                  {empty ?? <p className="py-6 text-center text-primer-700">Nothing to show.</p>}
                </td>
              </tr>
            ) : (
              rows.map((row) => (
                <tr key={row.id} className="border-b border-primer-100 last:border-b-0 hover:bg-primer-50">
                  {row.getVisibleCells().map((cell) => {
                    const meta = cell.column.columnDef.meta;
                    const Cell = meta?.rowHeader ? "th" : "td";
                    return (
                      <Cell
                        key={cell.id}
                        {...(meta?.rowHeader ? { scope: "row" } : {})}
                        className={cn("px-2 py-2.5 align-middle sm:px-3", meta?.rowHeader && "font-normal", meta?.className)}
                      >
                        {flexRender(cell.column.columnDef.cell, cell.getContext())}
                      </Cell>
                    );
                  })}
                </tr>
              ))
            )}
          </tbody>
        </table>
      </div>
      {pagination ? <DataTablePagination {...pagination} /> : null}
    </div>
  );
}
