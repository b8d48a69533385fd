import { ArrowRight } from "lucide-react";
import type { StageEventDto } from "@shared/schemas/job.schema";
import { Panel } from "@/components/ui/panel";
import { formatDateTime } from "@/utils/format-date";
import { StageBadge } from "./stage-badge";

/**
 * The job's timeline, newest first: each stage change (from → to) and each event that left the stage as it was (a
 * change order sent or answered), with who, when, and the note left with it.
 */
export function StageHistory({ events, className }: { events: StageEventDto[]; className?: string }) {
  return (
    <Panel title="Timeline" titleId="stage-history-heading" className={className}>
      {events.length === 0 ? (
        <p className="text-sm text-primer-700">Nothing recorded yet.</p>
      ) : (
        <ol className="relative flex flex-col gap-4 border-l-2 border-primer-200 pl-5">
          {events.map((e) => (
            <li key={e.id} className="relative">
              <span aria-hidden className="absolute top-1.5 -left-[1.69rem] size-3 rounded-full border-2 border-white bg-ink-600" />
              <div className="flex flex-wrap items-center gap-1.5">
                {e.fromStage && e.fromStage !== e.toStage ? (
                  <>
                    <StageBadge stage={e.fromStage} />
                    <ArrowRight aria-label="to" className="size-4 text-primer-600" />
                  </>
                ) : null}
                <StageBadge stage={e.toStage} />
              </div>
              <p className="mt-1 text-sm text-primer-700">
                {e.byName} · <time dateTime={e.at}>{formatDateTime(e.at)}</time>
              </p>
              {e.note ? <p className="mt-1 rounded-md bg-primer-50 px-3 py-2 text-sm text-ink-900">{e.note}</p> : null}
            </li>
          ))}
        </ol>
      )}
    </Panel>
  );
}
