import { useState } from "react";
import type { JobDetailDto } from "@shared/schemas/job.schema";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { toast } from "@/components/ui/toast/toast-store";
import { useDeleteJob } from "../api/jobs.queries";

/** Only an inquiry can be deleted; the server answers 409 otherwise and we show its reason. */
export function DeleteJobDialog({ job, onClose, onDeleted }: { job: JobDetailDto; onClose: () => void; onDeleted: () => void }) {
  const remove = useDeleteJob();
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <Dialog title={`Delete job #${job.id}?`} description={job.title} onClose={onClose}>
      <div className="flex flex-col gap-4">
        {problem ? <Alert tone="error">{problem}</Alert> : null}
        <p>The inquiry, its items and its history are removed for good. To keep the record, move it to Cancelled instead.</p>
        <div className="flex flex-wrap gap-3">
          <Button
            variant="danger"
            size="lg"
            pending={remove.isPending}
            onClick={async () => {
              setProblem(null);
              try {
                await remove.mutateAsync(job.id);
                toast.success(`Deleted job #${job.id}`);
                onDeleted();
              } catch (error) {
                setProblem(isApiError(error) ? error.message : "The job could not be deleted.");
              }
            }}
          >
            Delete job
          </Button>
          <Button variant="ghost" size="lg" onClick={onClose}>
            Keep it
          </Button>
        </div>
      </div>
    </Dialog>
  );
}
