import type { JobDetailDto } from "@shared/schemas/job.schema";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { useDeleteJob } from "../api/jobs.queries";

/** Only an inquiry can be deleted; the server answers 409 otherwise and we show its reason. */
export function DeleteJobDialog({ job, onClose, onDeleted }: { job: JobDetailDto; onClose: () => void; onDeleted: () => void }) {
  const remove = useDeleteJob();
  return (
    <ConfirmDialog
      title={`Delete job #${job.id}?`}
      description={job.title}
      confirmLabel="Delete job"
      keepLabel="Keep it"
      pending={remove.isPending}
      failure="The job could not be deleted."
      onConfirm={async () => {
        await remove.mutateAsync(job.id);
        return `Deleted job #${job.id}`;
      }}
      onDone={onDeleted}
      onClose={onClose}
    >
      The inquiry, its items and its history are removed for good. To keep the record, move it to Cancelled instead.
    </ConfirmDialog>
  );
}
