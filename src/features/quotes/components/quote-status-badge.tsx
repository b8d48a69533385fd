import { QUOTE_STATUS_LABELS, type QuoteStatus } from "@shared/schemas/quote.schema";
import { cn } from "@/utils/cn";

const TONES: Record<QuoteStatus, string> = {
  draft: "bg-primer-100 text-primer-800 ring-primer-300",
  sent: "bg-sky-50 text-sky-900 ring-sky-300",
  viewed: "bg-ink-50 text-ink-800 ring-ink-200",
  approved: "bg-emerald-50 text-emerald-900 ring-emerald-300",
  declined: "bg-red-50 text-red-900 ring-red-300",
  expired: "bg-flake-50 text-flake-800 ring-flake-300",
};

/** A quote's status, written out (colour is never the only cue). */
export function QuoteStatusBadge({ status, size = "md", className }: { status: QuoteStatus; size?: "md" | "lg"; className?: string }) {
  return (
    <span
      className={cn(
        "inline-flex items-center rounded-full font-semibold whitespace-nowrap ring-1 ring-inset",
        size === "lg" ? "px-3 py-1 text-sm" : "px-2.5 py-0.5 text-xs",
        TONES[status],
        className,
      )}
    >
      {QUOTE_STATUS_LABELS[status]}
    </span>
  );
}
