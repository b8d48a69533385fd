import { useState } from "react";
import { Trash2 } from "lucide-react";
import type { BoothDto } from "@shared/schemas/booth.schema";
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { TextField } from "@/components/ui/form/text-field";
import { newEntryKey, offlineQueue, type QueuedEntry } from "@/lib/offline/queue";
import { useOfflineQueue } from "@/lib/offline/use-offline";
import { formatClock } from "./booth-timers";

/**
 * This job's entries still on the tablet: those waiting to send, and those the server refused when they were sent
 * (the job moved on, the plan changed, prep was not signed off), each with the server's reason and a way out: send
 * it again, send it as the coat the card now expects, give the missing reason, or discard it. Nothing goes silently.
 */
export function QueuedEntries({ card }: { card: BoothDto }) {
  const queue = useOfflineQueue();
  const mine = queue.entries.filter((e) => e.jobId === card.job.id && e.key !== queue.firstTry);
  if (!mine.length) return null;
  const waiting = mine.filter((e) => e.state === "waiting").length;
  return (
    <Panel title={`On this tablet (${mine.length})`} titleId="queued-heading">
      {waiting ? <p className="mb-2 text-base text-primer-800">{waiting === 1 ? "1 entry waits" : `${waiting} entries wait`} to be sent, in the order they were made.</p> : null}
      <ol className="flex flex-col divide-y divide-primer-200" aria-label="Entries on this tablet">
        {mine.map((e) => (
          <li key={e.key} className="flex flex-col gap-2 py-3">
            <p className="text-base font-semibold text-ink-950">
              {e.label} <span className="font-normal text-primer-800">· made {formatClock(new Date(e.madeAt).toISOString())}</span>
            </p>
            {e.state === "refused" ? <Refused entry={e} card={card} /> : <p className="text-sm text-primer-800">Waiting to send</p>}
          </li>
        ))}
      </ol>
    </Panel>
  );
}

function Refused({ entry, card }: { entry: QueuedEntry; card: BoothDto }) {
  const [reason, setReason] = useState("");
  const next = card.next;
  const wantsReason = entry.problem?.fields.prepOverrideReason !== undefined;
  const asNextCoat =
    entry.kind === "coat" && next.state === "spray" && (next.layerId !== entry.body.layerId || next.coat !== entry.body.coatNumber) ? next : null;
  // A photo whose coat is gone (voided or removed in the office) can still go on the job.
  const onJob = entry.kind === "photo" && entry.problem?.status === 404 && entry.body.ownerType !== "job";
  const discard = () => {
    if (window.confirm(`Discard "${entry.label}"? It will not be on the job's record.`)) void offlineQueue.discard(entry.key);
  };
  return (
    <div className="flex flex-col gap-2 rounded-lg border-2 border-red-700 bg-red-50 p-3 text-red-950">
      <p className="text-base">
        <span className="font-semibold">Not accepted:</span> {entry.problem?.message}
      </p>
      {wantsReason ? (
        <TextField label="Reason for spraying before prep sign-off" value={reason} onChange={(e) => setReason(e.target.value)} className="min-h-12 text-lg" />
      ) : null}
      <div className="flex flex-wrap gap-2">
        {wantsReason ? (
          <Button size="lg" disabled={!reason.trim()} onClick={() => void offlineQueue.replace(entry.key, { key: newEntryKey(), label: entry.label, body: { ...entry.body, prepOverrideReason: reason.trim() } })}>
            Send with this reason
          </Button>
        ) : null}
        {asNextCoat ? (
          <Button
            size="lg"
            onClick={() =>
              void offlineQueue.replace(entry.key, {
                key: newEntryKey(),
                label: `Coat ${asNextCoat.coat} of ${asNextCoat.layerName}`,
                body: { ...entry.body, layerId: asNextCoat.layerId, coatNumber: asNextCoat.coat },
              })
            }
          >
            Send as coat {asNextCoat.coat} of {asNextCoat.layerName}
          </Button>
        ) : null}
        {onJob ? (
          <Button size="lg" onClick={() => void offlineQueue.replace(entry.key, { key: newEntryKey(), label: `${entry.label} (on the job)`, body: { ...entry.body, ownerType: "job", ownerId: entry.jobId }, waitsFor: undefined })}>
            Add it to the job instead
          </Button>
        ) : null}
        <Button variant="secondary" size="lg" onClick={() => void offlineQueue.retry(entry.key)}>
          Try again
        </Button>
        <Button variant="ghost" size="lg" icon={<Trash2 aria-hidden className="size-5" />} onClick={discard}>
          Discard
        </Button>
      </div>
    </div>
  );
}
