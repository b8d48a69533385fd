import { Link } from "react-router";
import { createColumnHelper } from "@tanstack/react-table";
import { formatCents } from "@shared/quote/index";
import type { QuoteDto } from "@shared/schemas/quote.schema";
import { formatDate, formatDay } from "@/utils/format-date";
import { QuoteStatusBadge } from "./quote-status-badge";
import { paths } from "@/config/paths";

const column = createColumnHelper<QuoteDto>();

/** Column ids match the API's quote sort fields where sortable: id, total, validUntil, updatedAt. */
export const quotesColumns = [
  column.accessor("id", {
    id: "id",
    header: "Quote",
    cell: (info) => (
      <Link to={paths.quote(info.getValue())} className="font-semibold whitespace-nowrap text-ink-950 hover:text-candy-700 hover:underline">
        #{info.getValue()} <span className="font-normal text-primer-700">v{info.row.original.version}</span>
      </Link>
    ),
    meta: { rowHeader: true },
  }),
  column.accessor("jobTitle", {
    id: "job",
    header: "Job",
    enableSorting: false,
    cell: (info) => (
      <span className="block min-w-[12rem]">
        <span className="block text-ink-950">{info.getValue()}</span>
        <span className="text-xs text-primer-700">{info.row.original.customerName}</span>
      </span>
    ),
  }),
  column.accessor("status", {
    id: "status",
    header: "Status",
    enableSorting: false,
    cell: (info) => <QuoteStatusBadge status={info.getValue()} />,
  }),
  column.accessor("totalCents", {
    id: "total",
    header: "Total",
    sortDescFirst: true,
    cell: (info) => <span className="tabular-nums font-semibold">{formatCents(info.getValue())}</span>,
    meta: { className: "text-right" },
  }),
  column.accessor("paidCents", {
    id: "paid",
    header: "Deposit",
    enableSorting: false,
    cell: (info) => {
      const q = info.row.original;
      return (
        <span className="tabular-nums whitespace-nowrap">
          {q.paidCents >= q.depositCents && q.depositCents > 0 ? (
            <span className="font-semibold text-emerald-800">{formatCents(q.paidCents)} paid</span>
          ) : q.status === "declined" || q.status === "expired" ? (
            <span className="text-primer-600">None</span>
          ) : (
            <span className="text-primer-700">{formatCents(q.depositCents)} {q.status === "approved" ? "due" : "asked"}</span>
          )}
        </span>
      );
    },
    meta: { className: "hidden md:table-cell text-right" },
  }),
  column.accessor("validUntil", {
    id: "validUntil",
    header: "Valid until",
    cell: (info) => <span className="whitespace-nowrap">{formatDate(info.getValue())}</span>,
    meta: { className: "hidden lg:table-cell" },
  }),
  column.accessor("updatedAt", {
    id: "updatedAt",
    header: "Updated",
    sortDescFirst: true,
    cell: (info) => <span className="whitespace-nowrap text-primer-700">{formatDay(info.getValue())}</span>,
    meta: { className: "hidden lg:table-cell" },
  }),
];
