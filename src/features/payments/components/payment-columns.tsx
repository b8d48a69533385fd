import { Link } from "react-router";
import { createColumnHelper } from "@tanstack/react-table";
import { TriangleAlert } from "lucide-react";
import { formatCents } from "@shared/quote/index";
import type { PaymentDto } from "@shared/schemas/payment.schema";
import { Button } from "@/components/ui/button";
import { paths } from "@/config/paths";
import { formatDateTime } from "@/utils/format-date";
import { PAYMENT_STATUS_TEXT } from "./payment-status";

const column = createColumnHelper<PaymentDto>();

export type PaymentActions = {
  onRefund: (p: PaymentDto) => void;
  onAccept: (p: PaymentDto) => void;
  accepting: number | null;
};

const linkClasses = "font-semibold text-ink-950 underline-offset-2 hover:text-candy-700 hover:underline";

/** The payments screen's columns; the owner refunds or accepts from the last one. */
export function paymentColumns({ onRefund, onAccept, accepting }: PaymentActions) {
  return [
    column.accessor("customerName", {
      id: "customer",
      header: "Customer and job",
      enableSorting: false,
      cell: ({ row }) => (
        <span className="flex flex-col">
          <span className="font-semibold text-ink-950">{row.original.customerName}</span>
          <Link to={paths.job(row.original.jobId)} className="text-sm text-primer-800 underline-offset-2 hover:text-candy-700 hover:underline">
            {row.original.jobTitle}
          </Link>
        </span>
      ),
      meta: { rowHeader: true, className: "align-top" },
    }),
    column.accessor("paidAt", {
      id: "paidAt",
      header: "Paid",
      enableSorting: false,
      cell: (info) => <span className="whitespace-nowrap">{formatDateTime(info.getValue())}</span>,
      meta: { className: "align-top" },
    }),
    column.display({
      id: "quote",
      header: "Quote",
      cell: ({ row }) => (
        <Link to={paths.quote(row.original.quoteId)} className={linkClasses}>
          #{row.original.quoteId} v{row.original.version}
        </Link>
      ),
      meta: { className: "align-top whitespace-nowrap" },
    }),
    column.accessor("amountCents", {
      id: "amount",
      header: "Amount",
      enableSorting: false,
      cell: ({ row }) => {
        const p = row.original;
        return (
          <span className="flex flex-col items-end">
            <span className="font-semibold tabular-nums text-ink-950">{formatCents(p.amountCents)}</span>
            {p.amountCents !== p.expectedCents ? <span className="text-xs text-primer-700">asked {formatCents(p.expectedCents)}</span> : null}
            {p.refundedCents > 0 ? <span className="text-xs text-primer-700">refunded {formatCents(p.refundedCents)}</span> : null}
          </span>
        );
      },
      meta: { className: "align-top text-right" },
    }),
    column.display({
      id: "status",
      header: "Status",
      cell: ({ row }) => {
        const p = row.original;
        return (
          <span className="flex flex-col gap-1">
            {p.needsReview ? (
              <span className="inline-flex w-fit items-center gap-1 rounded-full bg-flake-100 px-2 py-0.5 text-xs font-bold text-flake-900">
                <TriangleAlert aria-hidden className="size-3.5" /> To check
              </span>
            ) : null}
            <span className="font-semibold text-ink-900">{PAYMENT_STATUS_TEXT[p.status]}</span>
            {p.flagged ? <span className="max-w-[22rem] text-sm text-ink-900">{p.flagReason}</span> : null}
            {p.flagged && p.reviewedAt ? <span className="text-xs text-primer-700">Accepted {formatDateTime(p.reviewedAt)}</span> : null}
          </span>
        );
      },
      meta: { className: "align-top min-w-[14rem]" },
    }),
    column.display({
      id: "actions",
      header: "Action",
      cell: ({ row }) => {
        const p = row.original;
        const left = p.amountCents - p.refundedCents;
        return (
          <span className="flex flex-col items-start gap-2">
            {left > 0 ? (
              <Button size="sm" variant={p.needsReview ? "danger" : "secondary"} onClick={() => onRefund(p)} aria-label={`Refund ${formatCents(left)} of payment #${p.id} to ${p.customerName}`}>
                Refund {formatCents(left)}
              </Button>
            ) : null}
            {p.needsReview ? (
              <Button size="sm" variant="ghost" pending={accepting === p.id} onClick={() => onAccept(p)} aria-label={`Accept payment #${p.id} from ${p.customerName}`}>
                Accept
              </Button>
            ) : null}
          </span>
        );
      },
      meta: { className: "align-top" },
    }),
  ];
}
