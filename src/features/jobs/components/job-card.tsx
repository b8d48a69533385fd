import { useState } from "react";
import { Link } from "react-router";
import { ArrowRightLeft, CalendarClock, Layers, UserRound } from "lucide-react";
import type { Stage } from "@shared/domain/stages";
import type { JobDto } from "@shared/schemas/job.schema";
import { Button } from "@/components/ui/button";
import { paths } from "@/config/paths";
import { cn } from "@/utils/cn";
import { DueDate, dueStatus } from "./due-date";
import { StageMoveDialog } from "./stage-move-dialog";

const slotFormat = new Intl.DateTimeFormat(undefined, { weekday: "short", day: "numeric", month: "short", hour: "2-digit", minute: "2-digit" });
const boothSlotText = (iso: string) => slotFormat.format(Date.parse(iso));

/** One job on the board: what it is, whose, when, who sprays it, and a way to move it on. */
export function JobCard({ job, moves }: { job: JobDto; moves: readonly Stage[] }) {
  const [moving, setMoving] = useState(false);
  const overdue = dueStatus(job.dueDate, job.stage) === "overdue";
  const titleId = `job-card-${job.id}`;
  return (
    <article
      aria-labelledby={titleId}
      className={cn(
        "flex flex-col gap-2 rounded-lg border bg-white p-3 shadow-card",
        overdue ? "border-red-300 border-l-4 border-l-red-700" : "border-primer-200",
      )}
    >
      <h3 id={titleId} className="text-[0.95rem] leading-snug font-semibold">
        <Link to={paths.job(job.id)} className="rounded-sm text-ink-950 hover:text-candy-700 hover:underline">
          <span className="text-primer-600">#{job.id}</span> {job.title}
        </Link>
      </h3>
      <p className="text-sm text-ink-900">{job.customerName}</p>
      <div className="flex flex-wrap items-center gap-x-3 gap-y-1 text-sm">
        <DueDate dueDate={job.dueDate} stage={job.stage} />
      </div>
      <div className="flex flex-wrap items-center gap-x-3 gap-y-1 text-sm text-primer-700">
        <span className="inline-flex items-center gap-1">
          <UserRound aria-hidden className="size-4" />
          <span className="sr-only">Painter:</span>
          {job.assignedPainterName ?? "Unassigned"}
        </span>
        <span className="inline-flex items-center gap-1">
          <Layers aria-hidden className="size-4" />
          {job.itemCount} {job.itemCount === 1 ? "item" : "items"}
        </span>
      </div>
      {job.nextBoothSlot ? (
        <p className="inline-flex items-center gap-1 text-sm text-ink-900">
          <CalendarClock aria-hidden className="size-4 text-primer-700" />
          <span>
            <span className="sr-only">Next booth slot: </span>
            {job.nextBoothSlot.boothName}, {boothSlotText(job.nextBoothSlot.startsAt)}
          </span>
        </p>
      ) : null}
      {moves.length > 0 ? (
        <Button
          variant="secondary"
          size="md"
          block
          className="mt-1"
          onClick={() => setMoving(true)}
          icon={<ArrowRightLeft aria-hidden className="size-4" />}
          aria-label={`Move #${job.id} ${job.title}`}
        >
          Move…
        </Button>
      ) : null}
      {moving ? <StageMoveDialog jobId={job.id} title={job.title} current={job.stage} moves={moves} onClose={() => setMoving(false)} /> : null}
    </article>
  );
}
