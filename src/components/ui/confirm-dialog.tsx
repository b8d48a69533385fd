import { useState, type ReactNode } from "react";
import { isApiError } from "@/lib/api-client";
import { Alert } from "./alert";
import { Button } from "./button";
import { Dialog } from "./dialog";
import { toast } from "./toast/toast-store";

export type ConfirmDialogProps = {
  title: ReactNode;
  description?: ReactNode;
  /** What happens if the user goes ahead, in a sentence or two. */
  children: ReactNode;
  confirmLabel: string;
  keepLabel?: string;
  /** Danger for what cannot be undone; primary for a harmless change. */
  tone?: "danger" | "primary";
  pending: boolean;
  /** Does it; resolves with the words for the success toast. A refusal from the server is shown in the dialog. */
  onConfirm: () => Promise<string>;
  /** Shown when the action fails without a reason from the server. */
  failure: string;
  /** After success (defaults to closing). */
  onDone?: () => void;
  onClose: () => void;
};

/** Are you sure? One dialog for every confirm-then-act step: the server's reason for a refusal stays in view. */
export function ConfirmDialog({ title, description, children, confirmLabel, keepLabel = "Keep", tone = "danger", pending, onConfirm, failure, onDone, onClose }: ConfirmDialogProps) {
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <Dialog title={title} description={description} onClose={onClose}>
      <div className="flex flex-col gap-4">
        {problem ? (
          <Alert tone="error" title="Not done">
            {problem}
          </Alert>
        ) : null}
        <div>{children}</div>
        <div className="flex flex-wrap gap-3">
          <Button
            variant={tone}
            size="lg"
            pending={pending}
            onClick={async () => {
              setProblem(null);
              try {
                toast.success(await onConfirm());
                (onDone ?? onClose)();
              } catch (error) {
                setProblem(isApiError(error) ? error.message : failure);
              }
            }}
          >
            {confirmLabel}
          </Button>
          <Button variant="ghost" size="lg" onClick={onClose}>
            {keepLabel}
          </Button>
        </div>
      </div>
    </Dialog>
  );
}
