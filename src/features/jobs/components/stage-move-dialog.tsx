import { STAGE_LABELS, type Stage } from "@shared/domain/stages";
import { Dialog } from "@/components/ui/dialog";
import { StageMoveOptions } from "./stage-move-options";

export function StageMoveDialog({
  jobId,
  title,
  current,
  moves,
  onClose,
}: {
  jobId: number;
  title: string;
  current: Stage;
  moves: readonly Stage[];
  onClose: () => void;
}) {
  return (
    <Dialog title={`Move #${jobId}`} description={`${title} · now ${STAGE_LABELS[current]}`} onClose={onClose}>
      <StageMoveOptions jobId={jobId} current={current} moves={moves} onMoved={onClose} layout="stack" />
    </Dialog>
  );
}
