import { Link } from "react-router";
import { createColumnHelper } from "@tanstack/react-table";
import type { CustomerDto } from "@shared/schemas/customer.schema";
import { paths } from "@/config/paths";
import { formatDay } from "@/utils/format-date";

const column = createColumnHelper<CustomerDto>();

/** Column ids match the API's customer sort fields: name, email, jobCount, createdAt. */
export const customersColumns = [
  column.accessor("name", {
    id: "name",
    header: "Name",
    cell: (info) => (
      <Link to={paths.customer(info.row.original.id)} className="font-semibold text-ink-950 hover:text-candy-700 hover:underline">
        {info.getValue()}
      </Link>
    ),
    meta: { rowHeader: true, className: "min-w-[12rem]" },
  }),
  column.accessor("email", {
    id: "email",
    header: "Email",
    cell: (info) => info.getValue() ?? <span className="text-primer-600">None</span>,
    meta: { className: "hidden md:table-cell" },
  }),
  column.accessor("phone", {
    id: "phone",
    header: "Phone",
    enableSorting: false,
    cell: (info) => (info.getValue() ? <span className="whitespace-nowrap">{info.getValue()}</span> : <span className="text-primer-600">None</span>),
  }),
  column.accessor("jobCount", {
    id: "jobCount",
    header: "Jobs",
    sortDescFirst: true,
    cell: (info) => <span className="tabular-nums">{info.getValue()}</span>,
    meta: { className: "text-right" },
  }),
  column.accessor("createdAt", {
    id: "createdAt",
    header: "Added",
    sortDescFirst: true,
    cell: (info) => <span className="whitespace-nowrap text-primer-700">{formatDay(info.getValue())}</span>,
    meta: { className: "hidden lg:table-cell" },
  }),
];
