import { Link } from "react-router";
import { createColumnHelper } from "@tanstack/react-table";
import type { JobDto } from "@shared/schemas/job.schema";
import { paths } from "@/config/paths";
import { formatDateTime, formatDay } from "@/utils/format-date";
import { DueDate } from "./due-date";
import { StageBadge } from "./stage-badge";

const column = createColumnHelper<JobDto>();

/**
 * The jobs table's columns. Column ids are the API's sort fields (id, title, customer, stage, dueDate, updatedAt),
 * so the table's sorting state goes straight into `?sort=`.
 */
export const jobsColumns = [
  column.accessor("id", {
    id: "id",
    header: "No.",
    cell: (info) => <span className="text-primer-700 tabular-nums">#{info.getValue()}</span>,
    sortDescFirst: true,
    meta: { className: "hidden w-16 md:table-cell" },
  }),
  column.accessor("title", {
    id: "title",
    header: "Title",
    // On phones the number and customer sit with the title, so stage and due date stay in view.
    cell: (info) => (
      <>
        <Link to={paths.job(info.row.original.id)} className="font-semibold text-ink-950 hover:text-candy-700 hover:underline">
          <span className="text-primer-600 md:hidden">#{info.row.original.id} </span>
          {info.getValue()}
        </Link>
        <span className="mt-0.5 block text-sm text-primer-700 sm:hidden">{info.row.original.customerName}</span>
      </>
    ),
    meta: { rowHeader: true, className: "min-w-[9rem]" },

  }),
  column.accessor("customerName", { id: "customer", header: "Customer", meta: { className: "hidden sm:table-cell" } }),
  column.accessor("stage", { id: "stage", header: "Stage", cell: (info) => <StageBadge stage={info.getValue()} /> }),
  column.accessor("dueDate", {
    id: "dueDate",
    header: "Due",
    cell: (info) => <DueDate dueDate={info.getValue()} stage={info.row.original.stage} className="text-sm" />,
  }),
  column.accessor("assignedPainterName", {
    id: "painter",
    header: "Painter",
    enableSorting: false,
    cell: (info) => info.getValue() ?? <span className="text-primer-600">Unassigned</span>,
    meta: { className: "hidden sm:table-cell" },
  }),
  column.accessor("itemCount", {
    id: "items",
    header: "Items",
    enableSorting: false,
    cell: (info) => <span className="tabular-nums">{info.getValue()}</span>,
    meta: { className: "hidden text-right lg:table-cell" },
  }),
  column.accessor("updatedAt", {
    id: "updatedAt",
    header: "Updated",
    sortDescFirst: true,
    cell: (info) => (
      <time dateTime={info.getValue()} title={formatDateTime(info.getValue())} className="whitespace-nowrap text-primer-700">
        {formatDay(info.getValue())}
      </time>
    ),
    meta: { className: "hidden xl:table-cell" },
  }),
];
