import type { ReactNode } from "react";
import { useQuery } from "@tanstack/react-query";
import type { SortingState, Updater } from "@tanstack/react-table";
import { ListChecks } from "lucide-react";
import type { PainterDto } from "@shared/schemas/user.schema";
import { DataTable } from "@/components/ui/data-table/data-table";
import { EmptyState } from "@/components/ui/empty-state";
import { Spinner } from "@/components/ui/spinner";
import { sortingToSort, sortToSorting } from "@/hooks/use-list-search-params";
import { jobQueries } from "../api/jobs.queries";
import { useJobListParams } from "../hooks/use-job-list-params";
import { jobsColumns } from "./jobs-columns";
import { JobsFilters } from "./jobs-filters";

/** The jobs list with search, filters, server-side sorting and paging, all kept in the URL. */
export function JobsTable({ painters, emptyAction }: { painters?: PainterDto[]; emptyAction?: ReactNode }) {
  const params = useJobListParams();
  const { data, isPending, isPlaceholderData, isFetching } = useQuery(jobQueries.list(params.query));
  const sorting = sortToSorting(params.sort);

  const onSortingChange = (updater: Updater<SortingState>) => {
    const next = typeof updater === "function" ? updater(sorting) : updater;
    params.update({ sort: sortingToSort(next) });
  };

  return (
    <>
      <JobsFilters
        q={params.q}
        stages={params.stages}
        due={params.due}
        painterId={params.painterId}
        painters={painters}
        customerFiltered={params.customerId !== undefined}
        filtered={params.filtered}
        onChange={params.update}
      />
      {isPending ? (
        <Spinner label="Loading jobs…" />
      ) : (
        <DataTable
          label="Jobs"
          minWidthClassName="min-w-0"
          columns={jobsColumns}
          data={data?.items ?? []}
          getRowId={(job) => String(job.id)}
          sorting={sorting}
          onSortingChange={onSortingChange}
          isFetching={isPlaceholderData && isFetching}
          pagination={{
            page: params.page,
            pageSize: params.pageSize,
            total: data?.total ?? 0,
            noun: "jobs",
            onPageChange: (page) => params.update({ page: page > 1 ? page : null }),
            onPageSizeChange: (pageSize) => params.update({ pageSize }),
          }}
          empty={
            <EmptyState icon={<ListChecks aria-hidden />} title={params.filtered ? "No jobs match these filters" : "No jobs yet"} action={params.filtered ? undefined : emptyAction} className="border-0">
              {params.filtered ? "Try fewer stages, another date filter or a shorter search." : null}
            </EmptyState>
          }
        />
      )}
    </>
  );
}
