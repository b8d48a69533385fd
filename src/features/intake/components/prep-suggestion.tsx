import { useNavigate } from "react-router";
import { ListPlus } from "lucide-react";
import { formatCents } from "@shared/quote/index";
import type { InspectionDto } from "@shared/schemas/inspection.schema";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { toast } from "@/components/ui/toast/toast-store";
import { useAddPrepLine } from "../api/intake.queries";

/**
 * What the inspection suggests: prep hours item by item (with each reason), the quote line at the shop's labour
 * rate, and the action that puts it on the job's quote (or starts the quote with it).
 */
export function PrepSuggestion({ inspection, quoteHref }: { inspection: InspectionDto; quoteHref: (id: number) => string }) {
  const add = useAddPrepLine(inspection.jobId);
  const navigate = useNavigate();
  const s = inspection.suggestion;
  const q = inspection.quote;
  const addLine = () =>
    add.mutate(q ? { quoteId: q.id, editVersion: q.editVersion } : {}, {
      onSuccess: (quote) => {
        toast.success(`Prep line on quote #${quote.id}`);
        navigate(quoteHref(quote.id));
      },
      onError: (e) => toast.error(e.message),
    });
  return (
    <Panel title="Suggested prep" titleId="prep-suggestion-heading">
      {!s ? (
        <p className="text-base text-primer-800">Save the inspection to see the prep it suggests.</p>
      ) : (
        <div className="flex flex-col gap-4">
          <p className="text-3xl font-bold text-ink-950 tabular-nums">{s.hours} h</p>
          <ul className="flex flex-col gap-2 text-sm text-ink-950">
            {inspection.items
              .filter((i) => i.suggestion)
              .map((i) => (
                <li key={i.itemId}>
                  <span className="font-semibold">
                    {i.itemName}: {i.suggestion!.hours} h
                  </span>
                  <span className="block text-primer-800">{i.suggestion!.reasons.map((r) => `${r.what} ${r.hours} h`).join(" · ")}</span>
                </li>
              ))}
          </ul>
          <div className="rounded-lg bg-primer-50 p-3 text-sm">
            <p className="font-semibold text-ink-950">{s.line.description}</p>
            <p className="text-primer-800 tabular-nums">
              {s.hours} h × {formatCents(s.line.rateCents ?? 0)} = {formatCents(s.amountCents)}
            </p>
          </div>
          <p className="text-xs text-primer-800">Hours follow the shop's rules of thumb; change them on the quote if the job needs more or less.</p>
          {q?.status === "approved" ? (
            <Alert tone="info">Quote #{q.id} is approved by the customer; extra prep found now is a change to the job, not a quote edit.</Alert>
          ) : (
            <div>
              <Button size="lg" icon={<ListPlus aria-hidden className="size-5" />} pending={add.isPending} onClick={addLine}>
                {q ? (q.hasPrepLine ? `Update the prep line on quote #${q.id}` : `Add the suggested prep line to quote #${q.id}`) : "Start the quote with the suggested prep line"}
              </Button>
            </div>
          )}
        </div>
      )}
    </Panel>
  );
}
