import type { SuggestionDto } from "@shared/schemas/schedule.schema";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { toast } from "@/components/ui/toast/toast-store";
import { useAcceptSuggestion, useSuggest } from "../api/schedule.queries";

/**
 * A suggested schedule, earliest due date first and within every dry time and recoat window. It replaces what is
 * booked from now on only when the office accepts it.
 */
export function SuggestionPanel({ suggestion, onChange }: { suggestion: SuggestionDto | null; onChange: (s: SuggestionDto | null) => void }) {
  const suggest = useSuggest();
  const accept = useAcceptSuggestion();
  const ask = async () => {
    try {
      onChange(await suggest.mutateAsync({}));
    } catch (err) {
      toast.error(isApiError(err) ? err.message : "No suggestion came back");
    }
  };
  const take = async () => {
    if (!suggestion) return;
    try {
      const saved = await accept.mutateAsync(suggestion);
      onChange(null);
      toast.success(`Schedule saved: ${suggestion.sessions.length} sessions${saved.conflicts.length ? `, ${saved.conflicts.length} conflicts` : ""}`);
    } catch (err) {
      toast.error(isApiError(err) ? err.message : "Not saved");
    }
  };
  return (
    <section aria-labelledby="suggestion-heading" className="flex flex-col gap-3 rounded-xl border border-primer-300 bg-white p-4">
      <h2 id="suggestion-heading" className="text-lg font-semibold">
        Suggested schedule
      </h2>
      {suggestion ? (
        <>
          <p>
            {suggestion.sessions.length} sessions, earliest due date first, every layer after the one under it is dry and within its recoat window. The lanes above show it;
            nothing is saved until you accept it. Accepting replaces what is booked from now on.
          </p>
          {suggestion.unplaced.length ? (
            <Alert tone="warning" title="Not placed">
              <ul className="list-disc pl-5">
                {suggestion.unplaced.map((u) => (
                  <li key={u.jobId}>
                    {u.jobTitle}: {u.reason}
                  </li>
                ))}
              </ul>
            </Alert>
          ) : null}
          <div className="flex flex-wrap gap-2">
            <Button onClick={take} pending={accept.isPending}>
              Accept the suggestion
            </Button>
            <Button variant="secondary" onClick={() => onChange(null)}>
              Discard it
            </Button>
          </div>
        </>
      ) : (
        <div className="flex flex-wrap items-center gap-3">
          <p className="flex-1">Let Coatwright propose booth time for every job still to spray, earliest due date first. You can accept it, then move sessions by hand.</p>
          <Button variant="secondary" onClick={ask} pending={suggest.isPending}>
            Suggest a schedule
          </Button>
        </div>
      )}
    </section>
  );
}
