import { useQuery } from "@tanstack/react-query";
import { Columns3 } from "lucide-react";
import { OPEN_STAGES, PRODUCTION_STAGES } from "@shared/domain/stages";
import type { Role } from "@shared/domain/roles";
import { EmptyState } from "@/components/ui/empty-state";
import { Spinner } from "@/components/ui/spinner";
import { jobQueries } from "../api/jobs.queries";
import { BoardColumn } from "./board-column";
import { dueStatus } from "./due-date";

/** Jobs in columns by stage; scrolls sideways on a phone, one column at a time. */
export function JobBoard({ role, showClosed }: { role: Role; showClosed: boolean }) {
  const { data, isPending } = useQuery(jobQueries.board());
  if (isPending) return <Spinner label="Loading the board…" />;
  if (!data) return null;

  // Painters work the production stages; other open stages show only when one of their jobs is there.
  const columns = data.columns.filter((c) => {
    if (!OPEN_STAGES.includes(c.stage)) return showClosed;
    if (role === "painter") return PRODUCTION_STAGES.includes(c.stage) || c.total > 0;
    return true;
  });
  const open = data.columns.filter((c) => OPEN_STAGES.includes(c.stage));
  const openCount = open.reduce((n, c) => n + c.total, 0);
  const overdue = open.flatMap((c) => c.jobs).filter((j) => dueStatus(j.dueDate, j.stage) === "overdue").length;

  if (openCount === 0 && !showClosed)
    return (
      <EmptyState icon={<Columns3 aria-hidden />} title={role === "painter" ? "No jobs assigned to you" : "No open jobs"}>
        {role === "painter" ? "Jobs show up here once the office assigns them to you." : "New jobs start as inquiries and appear here."}
      </EmptyState>
    );

  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm text-primer-700" aria-live="polite">
        <strong className="text-ink-950">{openCount}</strong> open {openCount === 1 ? "job" : "jobs"}
        {overdue > 0 ? (
          <>
            {" · "}
            <strong className="text-red-800">{overdue} overdue</strong>
          </>
        ) : null}
      </p>
      <div
        className="scrollbar-thin relative -mx-4 flex snap-x snap-mandatory scroll-px-4 items-start gap-3 overflow-x-auto px-4 pb-4 sm:-mx-6 sm:scroll-px-6 sm:px-6 lg:-mx-8 lg:scroll-px-8 lg:px-8"
        tabIndex={0}
        aria-label="Board columns (scroll sideways)"
        role="region"
      >
        {columns.map((column) => (
          <BoardColumn key={column.stage} column={column} role={role} />
        ))}
      </div>
    </div>
  );
}
