import { useId, useState, type ReactNode } from "react";
import { ArrowLeft, ArrowRight, Ban } from "lucide-react";
import { STAGE_LABELS, STAGES, type Stage } from "@shared/domain/stages";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { controlClasses } from "@/components/ui/form/field";
import { toast } from "@/components/ui/toast/toast-store";
import { cn } from "@/utils/cn";
import { useChangeStage } from "../api/jobs.queries";

const NOTE_MAX = 500;

/** Forward moves first (the next step most prominent), then rework moves back, then cancelling. */
function orderMoves(current: Stage, moves: readonly Stage[]) {
  const at = STAGES.indexOf(current);
  const forward = moves.filter((s) => s !== "cancelled" && STAGES.indexOf(s) > at);
  const back = moves.filter((s) => s !== "cancelled" && STAGES.indexOf(s) < at);
  const cancel = moves.filter((s) => s === "cancelled");
  return { forward, back, cancel };
}

/**
 * Buttons for each stage this user may move the job to, with an optional note that goes into the stage history.
 * Big targets, no hover-only parts: it is used at the booth on a tablet.
 */
export function StageMoveOptions({
  jobId,
  current,
  moves,
  onMoved,
  layout = "row",
}: {
  jobId: number;
  current: Stage;
  moves: readonly Stage[];
  onMoved?: (stage: Stage) => void;
  layout?: "row" | "stack";
}) {
  const noteId = useId();
  const [note, setNote] = useState("");
  const [problem, setProblem] = useState<string | null>(null);
  const changeStage = useChangeStage();
  const { forward, back, cancel } = orderMoves(current, moves);

  if (moves.length === 0) return <p className="text-sm text-primer-700">No stage moves are open to you from {STAGE_LABELS[current]}.</p>;

  const move = async (stage: Stage) => {
    setProblem(null);
    try {
      await changeStage.mutateAsync({ jobId, stage, note: note.trim() || undefined });
      setNote("");
      toast.success(`Moved to ${STAGE_LABELS[stage]}`);
      onMoved?.(stage);
    } catch (error) {
      setProblem(isApiError(error) ? error.message : "The move did not go through. Try again.");
    }
  };

  const pendingStage = changeStage.isPending ? changeStage.variables?.stage : undefined;
  const button = (stage: Stage, variant: "primary" | "secondary" | "danger", icon: ReactNode) => (
    <Button
      key={stage}
      variant={variant}
      size="lg"
      block={layout === "stack"}
      pending={pendingStage === stage}
      disabled={changeStage.isPending}
      onClick={() => void move(stage)}
      icon={icon}
      className={layout === "stack" ? "justify-start" : undefined}
    >
      Move to {STAGE_LABELS[stage]}
    </Button>
  );

  return (
    <div className="flex flex-col gap-3">
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      <div className="flex flex-col gap-1.5">
        <label htmlFor={noteId} className="text-sm font-semibold text-ink-950">
          Note for the history <span className="font-normal text-primer-700">(optional)</span>
        </label>
        <input
          id={noteId}
          value={note}
          maxLength={NOTE_MAX}
          onChange={(e) => setNote(e.target.value)}
          placeholder="e.g. Second candy coat down, flash looked even"
          className={controlClasses}
        />
      </div>
      <div className={cn("flex gap-2", layout === "stack" ? "flex-col" : "flex-wrap")}>
        {forward.map((s, i) => button(s, i === 0 ? "primary" : "secondary", <ArrowRight aria-hidden className="size-5" />))}
        {back.map((s) => button(s, "secondary", <ArrowLeft aria-hidden className="size-5" />))}
        {cancel.map((s) => button(s, "danger", <Ban aria-hidden className="size-5" />))}
      </div>
    </div>
  );
}
