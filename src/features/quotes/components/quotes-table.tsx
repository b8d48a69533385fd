import { useQuery } from "@tanstack/react-query";
import type { SortingState, Updater } from "@tanstack/react-table";
import { ReceiptText } from "lucide-react";
import { QUOTE_STATUS_LABELS, QUOTE_STATUSES, type QuoteStatus } from "@shared/schemas/quote.schema";
import { SingleChoice } from "@/components/ui/choice-group";
import { DataTable } from "@/components/ui/data-table/data-table";
import { EmptyState } from "@/components/ui/empty-state";
import { SearchInput } from "@/components/ui/search-input";
import { Spinner } from "@/components/ui/spinner";
import { sortingToSort, sortToSorting, useListSearchParams } from "@/hooks/use-list-search-params";
import { quoteQueries } from "../api/quotes.queries";
import { quotesColumns } from "./quotes-columns";

const SORT_FIELDS = ["id", "total", "validUntil", "updatedAt"] as const;

/** Every quote, newest activity first; filter by status, search by job, customer or number. */
export function QuotesTable() {
  const params = useListSearchParams({ sortFields: SORT_FIELDS, defaultSort: "-updatedAt" });
  const statusParam = params.searchParams.get("status");
  const status = (QUOTE_STATUSES as readonly string[]).includes(statusParam ?? "") ? (statusParam as QuoteStatus) : undefined;
  const query = { page: params.page, pageSize: params.pageSize, sort: params.sort, ...(params.q ? { q: params.q } : {}), ...(status ? { status } : {}) };
  const { data, isPending, isPlaceholderData, isFetching } = useQuery(quoteQueries.list(query));
  const sorting = sortToSorting(params.sort);
  const onSortingChange = (updater: Updater<SortingState>) =>
    params.update({ sort: sortingToSort(typeof updater === "function" ? updater(sorting) : updater) });
  return (
    <>
      <div className="mb-4 flex flex-col gap-4">
        <div className="max-w-md">
          <SearchInput label="Search quotes" value={params.q} onSearch={(q) => params.update({ q }, { replace: true })} placeholder="Job, customer or quote number" />
        </div>
        <SingleChoice
          label="Status"
          options={[{ value: "all", label: "All" }, ...QUOTE_STATUSES.map((s) => ({ value: s, label: QUOTE_STATUS_LABELS[s] }))]}
          value={status ?? "all"}
          onChange={(v) => params.update({ status: v === "all" ? null : v })}
        />
      </div>
      {isPending ? (
        <Spinner label="Loading quotes…" />
      ) : (
        <DataTable
          label="Quotes"
          columns={quotesColumns}
          data={data?.items ?? []}
          getRowId={(q) => String(q.id)}
          sorting={sorting}
          onSortingChange={onSortingChange}
          isFetching={isPlaceholderData && isFetching}
          pagination={{
            page: params.page,
            pageSize: params.pageSize,
            total: data?.total ?? 0,
            noun: "quotes",
            onPageChange: (page) => params.update({ page: page > 1 ? page : null }),
            onPageSizeChange: (pageSize) => params.update({ pageSize }),
          }}
          empty={
            <EmptyState icon={<ReceiptText aria-hidden />} title={params.q || status ? "No quotes match" : "No quotes yet"} className="border-0">
              Start a quote from a job's page.
            </EmptyState>
          }
        />
      )}
    </>
  );
}
