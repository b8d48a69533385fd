import { CalendarClock, TriangleAlert } from "lucide-react";
import type { Stage } from "@shared/domain/stages";
import { daysFromToday, formatShortDate } from "@/utils/format-date";
import { cn } from "@/utils/cn";

/** Stages where a due date no longer matters (same rule as the server's "overdue" filter). */
const DONE: readonly Stage[] = ["ready", "delivered", "cancelled"];

export function dueStatus(dueDate: string | null, stage: Stage): "overdue" | "today" | "soon" | "later" | "none" {
  if (!dueDate || DONE.includes(stage)) return "none";
  const days = daysFromToday(dueDate);
  if (days === null) return "none";
  if (days < 0) return "overdue";
  if (days === 0) return "today";
  if (days <= 3) return "soon";
  return "later";
}

/** A due date with its urgency written out: "Overdue", "Due today". */
export function DueDate({ dueDate, stage, className }: { dueDate: string | null; stage: Stage; className?: string }) {
  if (!dueDate) return <span className={cn("text-primer-600", className)}>No due date</span>;
  const status = dueStatus(dueDate, stage);
  const text = formatShortDate(dueDate);
  if (status === "overdue")
    return (
      <span className={cn("inline-flex items-center gap-1 rounded-md bg-red-50 px-1.5 py-0.5 font-semibold text-red-800 ring-1 ring-red-300 ring-inset", className)}>
        <TriangleAlert aria-hidden className="size-3.5 shrink-0" />
        <span>
          Overdue<span className="font-medium">: {text}</span>
        </span>
      </span>
    );
  if (status === "today" || status === "soon")
    return (
      <span className={cn("inline-flex items-center gap-1 rounded-md bg-flake-100 px-1.5 py-0.5 font-semibold text-flake-900", className)}>
        <CalendarClock aria-hidden className="size-3.5 shrink-0" />
        {status === "today" ? "Due today" : `Due ${text}`}
      </span>
    );
  return <span className={cn("text-ink-900", className)}>{`Due ${text}`}</span>;
}
