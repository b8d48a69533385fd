import { useEffect, useState } from "react";
import { useBlocker } from "react-router";
import { Button } from "./button";
import { Dialog } from "./dialog";

/**
 * Warns before unsaved edits are lost: moving to another screen inside the app asks first (save and leave, leave
 * without saving, or stay), and closing or reloading the tab gets the browser's own "leave site?" question.
 */
export function LeaveGuard({ when, what, onSave }: { when: boolean; what: string; onSave?: () => Promise<boolean> }) {
  // Only a move to another screen; a replace (the app moving on by itself, e.g. after a discard) goes through.
  const blocker = useBlocker(({ currentLocation, nextLocation, historyAction }) => when && historyAction !== "REPLACE" && currentLocation.pathname !== nextLocation.pathname);
  const [saving, setSaving] = useState(false);

  useEffect(() => {
    if (!when) return;
    const warn = (e: BeforeUnloadEvent) => {
      e.preventDefault();
      // Older browsers need a value set to show their question.
      e.returnValue = "";
    };
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [when]);

  if (blocker.state !== "blocked") return null;
  return (
    <Dialog title="Leave without saving?" description={`Your changes to ${what} are not saved yet.`} onClose={() => blocker.reset()}>
      <div className="flex flex-wrap gap-3">
        {onSave ? (
          <Button
            pending={saving}
            onClick={async () => {
              setSaving(true);
              const saved = await onSave();
              setSaving(false);
              if (saved) blocker.proceed();
              else blocker.reset();
            }}
          >
            Save and leave
          </Button>
        ) : null}
        <Button variant="danger" onClick={() => blocker.proceed()}>
          Leave without saving
        </Button>
        <Button variant="ghost" onClick={() => blocker.reset()}>
          Stay on this page
        </Button>
      </div>
    </Dialog>
  );
}
