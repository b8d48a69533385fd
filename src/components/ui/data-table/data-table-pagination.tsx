import { useId } from "react";
import { ChevronLeft, ChevronRight } from "lucide-react";
import { PAGE_SIZES } from "@/hooks/use-list-search-params";
import { Button } from "../button";

export type DataTablePaginationProps = {
  page: number;
  pageSize: number;
  total: number;
  onPageChange: (page: number) => void;
  onPageSizeChange?: (pageSize: number) => void;
  /** What a row is, for "1–25 of 48 jobs". */
  noun?: string;
};

export function DataTablePagination({ page, pageSize, total, onPageChange, onPageSizeChange, noun = "rows" }: DataTablePaginationProps) {
  const sizeId = useId();
  const pageCount = Math.max(1, Math.ceil(total / pageSize));
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  return (
    <nav aria-label="Pagination" className="flex flex-wrap items-center justify-between gap-3 border-t border-primer-200 bg-primer-50 px-3 py-2">
      <p className="text-sm text-primer-700" aria-live="polite">
        {total === 0 ? `No ${noun}` : `${first}–${last} of ${total} ${noun}`}
      </p>
      <div className="flex flex-wrap items-center gap-2">
        {onPageSizeChange ? (
          <div className="flex items-center gap-2">
            <label htmlFor={sizeId} className="text-sm text-primer-700">
              Rows per page
            </label>
            <select
              id={sizeId}
              value={pageSize}
              onChange={(e) => onPageSizeChange(Number(e.target.value))}
              className="min-h-10 rounded-md border border-primer-300 bg-white px-2 text-sm"
            >
              {PAGE_SIZES.map((size) => (
                <option key={size} value={size}>
                  {size}
                </option>
              ))}
            </select>
          </div>
        ) : null}
        <Button variant="secondary" size="sm" onClick={() => onPageChange(page - 1)} disabled={page <= 1} icon={<ChevronLeft aria-hidden className="size-4" />}>
          Previous
        </Button>
        <span className="px-1 text-sm font-medium text-ink-900">
          Page {Math.min(page, pageCount)} of {pageCount}
        </span>
        <Button variant="secondary" size="sm" onClick={() => onPageChange(page + 1)} disabled={page >= pageCount}>
          Next
          <ChevronRight aria-hidden className="size-4" />
        </Button>
      </div>
    </nav>
  );
}
