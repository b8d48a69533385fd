import type { ReactNode } from "react";
import { useQuery } from "@tanstack/react-query";
import type { SortingState, Updater } from "@tanstack/react-table";
import { Contact } from "lucide-react";
import { DataTable } from "@/components/ui/data-table/data-table";
import { EmptyState } from "@/components/ui/empty-state";
import { SearchInput } from "@/components/ui/search-input";
import { Spinner } from "@/components/ui/spinner";
import { sortingToSort, sortToSorting, useListSearchParams } from "@/hooks/use-list-search-params";
import { customerQueries, type CustomerSortField } from "../api/customers.queries";
import { customersColumns } from "./customers-columns";

const SORT_FIELDS: readonly CustomerSortField[] = ["name", "email", "createdAt", "jobCount"];

export function CustomersTable({ emptyAction }: { emptyAction?: ReactNode }) {
  const params = useListSearchParams({ sortFields: SORT_FIELDS, defaultSort: "name" });
  const query = { page: params.page, pageSize: params.pageSize, sort: params.sort, ...(params.q ? { q: params.q } : {}) };
  const { data, isPending, isPlaceholderData, isFetching } = useQuery(customerQueries.list(query));
  const sorting = sortToSorting(params.sort);
  const onSortingChange = (updater: Updater<SortingState>) =>
    params.update({ sort: sortingToSort(typeof updater === "function" ? updater(sorting) : updater) });

  return (
    <>
      <div className="mb-4 max-w-md">
        <SearchInput
          label="Search customers"
          value={params.q}
          onSearch={(q) => params.update({ q }, { replace: true })}
          placeholder="Name, email or phone"
        />
      </div>
      {isPending ? (
        <Spinner label="Loading customers…" />
      ) : (
        <DataTable
          label="Customers"
          columns={customersColumns}
          data={data?.items ?? []}
          getRowId={(c) => String(c.id)}
          sorting={sorting}
          onSortingChange={onSortingChange}
          isFetching={isPlaceholderData && isFetching}
          pagination={{
            page: params.page,
            pageSize: params.pageSize,
            total: data?.total ?? 0,
            noun: "customers",
            onPageChange: (page) => params.update({ page: page > 1 ? page : null }),
            onPageSizeChange: (pageSize) => params.update({ pageSize }),
          }}
          empty={
            <EmptyState
              icon={<Contact aria-hidden />}
              title={params.q ? `No customers match “${params.q}”` : "No customers yet"}
              action={params.q ? undefined : emptyAction}
              className="border-0"
            />
          }
        />
      )}
    </>
  );
}
