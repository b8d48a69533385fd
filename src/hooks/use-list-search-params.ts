import { useCallback, useMemo } from "react";
import { useSearchParams } from "react-router";

export const PAGE_SIZES = [10, 25, 50, 100] as const;

type Options<F extends string> = {
  sortFields: readonly F[];
  defaultSort: F | `-${F}`;
  defaultPageSize?: number;
};

export type ListSearchParams<F extends string> = {
  page: number;
  pageSize: number;
  sort: F | `-${F}`;
  q: string;
  /** Raw access for feature-specific filters. */
  searchParams: URLSearchParams;
  /** Sets (or, with null/""/[], removes) params. Changing anything but the page goes back to page 1. */
  update: (patch: Record<string, string | number | readonly string[] | null | undefined>, options?: { replace?: boolean }) => void;
};

/** Paging, sorting and search from a list's URL, with defaults for anything missing or not allowed. */
export function readListParams<F extends string>(searchParams: URLSearchParams, { sortFields, defaultSort, defaultPageSize = 25 }: Options<F>) {
  const page = Math.max(1, Number.parseInt(searchParams.get("page") ?? "", 10) || 1);
  const sizeParam = Number.parseInt(searchParams.get("pageSize") ?? "", 10);
  const pageSize = (PAGE_SIZES as readonly number[]).includes(sizeParam) ? sizeParam : defaultPageSize;
  const sortParam = searchParams.get("sort") ?? "";
  const sortField = sortParam.replace(/^-/, "");
  const sort = (sortFields as readonly string[]).includes(sortField) ? (sortParam as F | `-${F}`) : defaultSort;
  const q = searchParams.get("q") ?? "";
  return { page, pageSize, sort, q };
}

/**
 * A list's paging, sorting and search live in the URL, so a filtered view can be bookmarked,
 * shared and restored with Back. Values the server would refuse fall back to defaults.
 */
export function useListSearchParams<F extends string>(options: Options<F>): ListSearchParams<F> {
  const [searchParams, setSearchParams] = useSearchParams();
  const { page, pageSize, sort, q } = readListParams(searchParams, options);

  const update = useCallback<ListSearchParams<F>["update"]>(
    (patch, options) => {
      setSearchParams(
        (prev) => {
          const next = new URLSearchParams(prev);
          for (const [key, value] of Object.entries(patch)) {
            const text = Array.isArray(value) ? value.join(",") : value == null ? "" : String(value);
            if (text === "") next.delete(key);
            else next.set(key, text);
          }
          if (!("page" in patch)) next.delete("page");
          return next;
        },
        { replace: options?.replace },
      );
    },
    [setSearchParams],
  );

  return useMemo(() => ({ page, pageSize, sort, q, searchParams, update }), [page, pageSize, sort, q, searchParams, update]);
}

/** "field" / "-field" ↔ TanStack Table's sorting state. */
export function sortToSorting(sort: string): { id: string; desc: boolean }[] {
  return sort ? [{ id: sort.replace(/^-/, ""), desc: sort.startsWith("-") }] : [];
}
export function sortingToSort(sorting: { id: string; desc: boolean }[]): string | null {
  const first = sorting[0];
  return first ? `${first.desc ? "-" : ""}${first.id}` : null;
}
