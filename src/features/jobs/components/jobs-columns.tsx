import { Link } from "react-router";
import { createColumnHelper } from "@tanstack/react-table";
import type { JobDto } from "@shared/schemas/job.schema";
import { paths } from "@/config/paths";
import { formatDateTime } from "@/utils/format-date";
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
    meta: { className: "w-16" },
  }),
  column.accessor("title", {
    id: "title",
    header: "Title",
    cell: (info) => (
      <Link to={paths.job(info.row.original.id)} className="font-semibold text-ink-950 hover:text-candy-700 hover:underline">
        {info.getValue()}
      </Link>
    ),
    meta: { rowHeader: true, className: "min-w-[14rem]" },
  }),
  column.accessor("customerName", { id: "customer", header: "Customer" }),
  column.accessor("stage", { id: "stage", header: "Stage", cell: (info) => <StageBadge stage={info.getValue()} /> }),
  column.accessor("dueDate", {
    id: "dueDate",
    header: "Due",
    cell: (info) => <DueDate dueDate={info.getValue()} stage={info.row.original.stage} className="text-sm whitespace-nowrap" />,
  }),
  column.accessor("assignedPainterName", {
    id: "painter",
    header: "Painter",
    enableSorting: false,
    cell: (info) => info.getValue() ?? <span className="text-primer-600">Unassigned</span>,
  }),
  column.accessor("itemCount", {
    id: "items",
    header: "Items",
    enableSorting: false,
    cell: (info) => <span className="tabular-nums">{info.getValue()}</span>,
    meta: { className: "text-right" },
  }),
  column.accessor("updatedAt", {
    id: "updatedAt",
    header: "Updated",
    sortDescFirst: true,
    cell: (info) => <span className="whitespace-nowrap text-primer-700">{formatDateTime(info.getValue())}</span>,
  }),
];
