import { useState } from "react";
import { FileText, Repeat2 } from "lucide-react";
import type { Stage } from "@shared/domain/stages";
import { Button, ButtonLink } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { paths } from "@/config/paths";
import { RepeatFinishDialog } from "./repeat-finish-dialog";

/** Stages from which something has been sprayed, so the job has a finish record. */
const SPRAYED: readonly Stage[] = ["in_booth", "curing", "finishing", "ready", "delivered"];

/** The job page's way to its finish record, and (for the office) to repeating the finish as a new job. */
export function JobFinishRecordPanel({ job, canRepeat }: { job: { id: number; title: string; stage: Stage; customerId: number }; canRepeat: boolean }) {
  const [repeating, setRepeating] = useState(false);
  if (!SPRAYED.includes(job.stage)) return null;
  return (
    <Panel title="Finish record" titleId="finish-record-heading">
      <p className="text-ink-950">What was really sprayed, layer by layer: batches and lots, coats with their times, booth and gun set-up.</p>
      <div className="mt-3 flex flex-wrap gap-2">
        <ButtonLink to={paths.jobFinishRecord(job.id)} variant="secondary" icon={<FileText aria-hidden className="size-4" />}>
          Open the finish record
        </ButtonLink>
        {canRepeat ? (
          <Button variant="secondary" icon={<Repeat2 aria-hidden className="size-4" />} onClick={() => setRepeating(true)}>
            Repeat this finish…
          </Button>
        ) : null}
      </div>
      {repeating ? (
        <RepeatFinishDialog from={{ jobId: job.id }} defaultCustomerId={job.customerId} defaultTitle={`${job.title} (repeat)`} onClose={() => setRepeating(false)} />
      ) : null}
    </Panel>
  );
}
