import { Alert } from "./alert";
import { Button } from "./button";

const when = (iso: string | null) => (iso ? new Intl.DateTimeFormat(undefined, { dateStyle: "medium", timeStyle: "short" }).format(Date.parse(iso)) : null);

/** Someone saved the record while this user was editing it: who and when, and the two ways on. What was typed stays. */
export function VersionConflictNotice({
  what,
  conflict,
  onReload,
  onSaveAgain,
  busy,
}: {
  what: string;
  conflict: { changedBy: string | null; changedAt: string | null };
  onReload: () => void;
  onSaveAgain: () => void;
  busy?: boolean;
}) {
  const at = when(conflict.changedAt);
  return (
    <Alert tone="warning" title={`${conflict.changedBy ?? "Someone"} changed this ${what}${at ? ` at ${at}` : ""}`}>
      <p>Your changes are not saved yet; they are still in the form. Load their version (your changes are dropped), or save yours over theirs.</p>
      <div className="mt-2 flex flex-wrap gap-2">
        <Button size="sm" variant="secondary" onClick={onReload}>
          Load their version
        </Button>
        <Button size="sm" onClick={onSaveAgain} pending={busy}>
          Save mine over theirs
        </Button>
      </div>
    </Alert>
  );
}
