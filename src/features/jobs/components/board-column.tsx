import { Link } from "react-router";
import { nextStagesFor, STAGE_HINTS, STAGE_LABELS } from "@shared/domain/stages";
import type { Role } from "@shared/domain/roles";
import type { BoardColumnDto } from "@shared/schemas/job.schema";
import { paths } from "@/config/paths";
import { cn } from "@/utils/cn";
import { JobCard } from "./job-card";
import { STAGE_TONES } from "./stage-badge";

export function BoardColumn({ column, role }: { column: BoardColumnDto; role: Role }) {
  const headingId = `board-${column.stage}`;
  const moves = nextStagesFor(role, column.stage);
  const hidden = column.total - column.jobs.length;
  return (
    <section
      aria-labelledby={headingId}
      className="flex w-[85vw] max-w-[20rem] shrink-0 snap-start flex-col rounded-xl bg-primer-100 sm:w-72"
    >
      <div className="sticky top-0 rounded-t-xl bg-primer-100 px-3 pt-3 pb-2">
        <div className={cn("mb-2 h-1.5 rounded-full", STAGE_TONES[column.stage].bar)} aria-hidden />
        <h2 id={headingId} className="flex items-center justify-between gap-2 text-base font-bold text-ink-950">
          {STAGE_LABELS[column.stage]}
          <span className="rounded-full bg-white px-2.5 py-0.5 text-sm font-semibold text-ink-900 ring-1 ring-primer-300">
            {column.total}
            <span className="sr-only"> {column.total === 1 ? "job" : "jobs"}</span>
          </span>
        </h2>
        <p className="mt-0.5 text-xs text-primer-700">{STAGE_HINTS[column.stage]}</p>
      </div>
      <ul className="flex flex-col gap-2 px-2 pb-3">
        {column.jobs.length === 0 ? (
          <li className="rounded-lg border border-dashed border-primer-300 px-3 py-6 text-center text-sm text-primer-700">No jobs</li>
        ) : (
          column.jobs.map((job) => (
            <li key={job.id}>
              <JobCard job={job} moves={moves} />
            </li>
          ))
        )}
        {hidden > 0 ? (
          <li>
            <Link
              to={`${paths.jobs}?stage=${column.stage}`}
              className="flex min-h-11 items-center justify-center rounded-lg text-sm font-semibold text-candy-700 hover:bg-white"
            >
              {hidden} more in {STAGE_LABELS[column.stage]}: see the list
            </Link>
          </li>
        ) : null}
      </ul>
    </section>
  );
}
