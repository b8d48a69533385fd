import { lazy, Suspense, useState } from "react";
import type { BoothDto, CoatLogDto } from "@shared/schemas/booth.schema";
import { TIMING_RULE_LABELS } from "@shared/domain/booth-timing";
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { formatDateTime } from "@/utils/format-date";
import { cn } from "@/utils/cn";
import { formatClock } from "./booth-timers";
import { isWaiting } from "../api/waiting";

// Corrections are rare; the dialog and its form library load when the painter first opens one.
const CorrectCoatDialog = lazy(() => import("./correct-coat-dialog").then((m) => ({ default: m.CorrectCoatDialog })));

const STATUS: Record<CoatLogDto["status"], string> = { counts: "", corrected: "Corrected", voided: "Not sprayed", correction: "Correction" };

function conditions(e: CoatLogDto) {
  return [e.boothTemp != null && e.tempUnit ? `${e.boothTemp} °${e.tempUnit}` : null, e.humidityPct != null ? `${e.humidityPct}% RH` : null].filter(Boolean).join(" · ") || "No reading";
}

/** Every entry, newest first, corrections beside what they correct. Entries are never edited, only corrected. */
export function CoatLogList({ card }: { card: BoothDto }) {
  const [correcting, setCorrecting] = useState<CoatLogDto | null>(null);
  const entries = [...card.coatLogs].reverse();
  const latestCounting = card.coatLogs.filter((c) => c.status === "counts" || c.status === "corrected").at(-1);
  return (
    <Panel title={`Coat log (${card.coatLogs.filter((c) => c.status !== "correction").length})`} titleId="coat-log-heading">
      {entries.length === 0 ? (
        <p className="text-base text-primer-800">No coats logged yet.</p>
      ) : (
        <ol className="flex flex-col divide-y divide-primer-200" aria-label="Coat log, newest first">
          {entries.map((e) => (
            <li key={e.id} className={cn("flex flex-wrap items-center gap-x-4 gap-y-1 py-3", e.status === "voided" && "opacity-70")}>
              <div className="min-w-0 flex-1">
                <p className={cn("text-base font-semibold text-ink-950", e.status === "voided" && "line-through")}>
                  {e.status === "correction" ? `Correction of coat ${e.coatNumber} · ${e.layerName}` : `Coat ${e.coatNumber} · ${e.layerName}`}
                  {isWaiting(e) ? <span className="ml-2 rounded bg-flake-100 px-2 py-0.5 text-xs font-semibold text-flake-900">Waiting to send</span> : null}
                  {STATUS[e.status] && e.status !== "correction" ? <span className="ml-2 rounded bg-primer-200 px-2 py-0.5 text-xs font-semibold text-ink-950 no-underline">{STATUS[e.status]}</span> : null}
                </p>
                <p className="text-sm text-primer-800">
                  <time dateTime={e.at}>{formatClock(e.at)}</time> · {conditions(e)} · {e.painterName ?? "Former user"}
                  {e.status === "correction" ? ` · written ${formatDateTime(e.loggedAt)}` : ""}
                </p>
                {e.correctionReason ? <p className="text-sm text-ink-950">{e.voids ? "Not sprayed: " : "Why: "}{e.correctionReason}</p> : null}
                {e.note ? <p className="text-sm text-ink-950">Note: {e.note}</p> : null}
                {e.prepOverrideReason ? <p className="text-sm font-semibold text-flake-800">Sprayed before prep sign-off: {e.prepOverrideReason}</p> : null}
                {e.timingOverrideReason ? (
                  <p className="text-sm font-semibold text-flake-800" data-testid="timing-override">
                    Sprayed against the {(e.timingBreaches ?? []).map((b) => TIMING_RULE_LABELS[b.rule].toLowerCase()).join(", ") || "timing"} rule: {e.timingOverrideReason}
                  </p>
                ) : null}
              </div>
              {card.canLog && !isWaiting(e) && (e.status === "counts" || e.status === "corrected") ? (
                <Button variant="secondary" size="lg" onClick={() => setCorrecting(e)}>
                  Correct<span className="sr-only"> coat {e.coatNumber} of {e.layerName}</span>
                </Button>
              ) : null}
            </li>
          ))}
        </ol>
      )}
      {correcting ? (
        <Suspense fallback={null}>
          <CorrectCoatDialog jobId={card.job.id} entry={correcting} canVoid={correcting.id === latestCounting?.id} onClose={() => setCorrecting(null)} />
        </Suspense>
      ) : null}
    </Panel>
  );
}
