import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { BadgeCheck } from "lucide-react";
import { approveQuoteInputSchema } from "@shared/schemas/quote.schema";
import type { PanelSignOffDto } from "@shared/schemas/colour-sign-off.schema";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/form/text-field";
import { toast } from "@/components/ui/toast/toast-store";
import { formatDateTime } from "@/utils/format-date";
import { cn } from "@/utils/cn";
import { portalQueries, useApprovePanel } from "../api/portal.queries";

type In = z.input<typeof approveQuoteInputSchema>;
type Out = z.output<typeof approveQuoteInputSchema>;

const ratio = (n: number) => String(Number(n.toFixed(3)));

/** One panel as sent: its photo, what it is, and how far it is from the target colour. */
function PanelFacts({ s }: { s: PanelSignOffDto }) {
  return (
    <div className="flex gap-3">
      {s.photo ? <img src={s.photo.thumbUrl} alt={`Photo of the test panel: ${s.label}`} className="size-24 shrink-0 rounded-lg border border-primer-300 object-cover" /> : null}
      <div className="min-w-0 text-sm">
        <p className="text-base font-semibold text-ink-950">{s.label}</p>
        <p className="text-primer-800">
          Let-down {ratio(s.letDownClear)} parts clear to {ratio(s.letDownToner)} toner, {s.coats} {s.coats === 1 ? "coat" : "coats"}
        </p>
        {s.deltaE != null && s.targetLabel ? (
          <p className="text-primer-800 tabular-nums">
            ΔE00 {s.deltaE.toFixed(2)} from {s.targetLabel}
          </p>
        ) : null}
      </div>
    </div>
  );
}

/**
 * The customer chooses the colour from the test panels the shop sent: tick one, sign with their name, approve. The
 * shop sprays the job to match it. Renders nothing when the shop has sent no panels.
 */
export function PortalColourChoice({ jobId, token }: { jobId: number; token?: string | null }) {
  const colour = useQuery(portalQueries.colourChoice(jobId, token));
  const approve = useApprovePanel(jobId, token);
  const [picked, setPicked] = useState<number | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<In, unknown, Out>({ resolver: zodResolver(approveQuoteInputSchema), defaultValues: { name: "", note: "" } });
  const data = colour.data;
  if (!data) return null;
  const approved = data.answered.find((s) => s.status === "approved" && s.panelId === data.approvedPanelId);
  if (!data.waiting.length) {
    // Nothing to choose: the agreed colour is shown beside; this says when the customer approved it.
    return approved ? (
      <p className="flex items-center gap-2 text-sm font-semibold text-emerald-900">
        <BadgeCheck aria-hidden className="size-5 shrink-0" />
        You approved {approved.label} in the portal, {formatDateTime(approved.decidedAt)}.
      </p>
    ) : null;
  }
  const submit = handleSubmit(async (values) => {
    setProblem(null);
    if (picked == null) {
      setProblem("Choose the panel you want first.");
      return;
    }
    try {
      await approve.mutateAsync({ ...values, panelId: picked });
      toast.success("Colour approved. Thank you!");
    } catch (e) {
      setProblem(applyServerErrors(e, setError, ["name", "note"]));
    }
  });
  return (
    <section aria-labelledby="colour-choice-heading" className="flex flex-col gap-4 rounded-2xl border border-primer-200 bg-white p-4 shadow-card sm:p-5">
      <h2 id="colour-choice-heading" className="text-xl font-bold text-ink-950">
        Choose your colour
      </h2>
      {approved ? <p className="text-sm text-primer-800">You approved {approved.label} earlier; the shop has sent new panels to choose from.</p> : null}
      <form onSubmit={submit} noValidate aria-label="Approve a colour" className="flex flex-col gap-4">
        <p className="text-ink-900">
          {data.waiting.length === 1 ? "The shop sprayed this test panel for you." : `The shop sprayed ${data.waiting.length} test panels for you.`} Photos on a screen never show a candy quite
          as it is; if you can, look at the panels in daylight at the shop. The panel you approve is the colour your parts are sprayed to.
        </p>
        <fieldset className="flex flex-col gap-3">
          <legend className="sr-only">Test panels</legend>
          {data.waiting.map((s) => (
            <label
              key={s.id}
              className={cn("flex cursor-pointer items-center gap-3 rounded-xl border-2 p-3", picked === s.panelId ? "border-candy-700 bg-candy-50" : "border-primer-300")}
            >
              <input type="radio" name="panel" value={s.panelId} checked={picked === s.panelId} onChange={() => setPicked(s.panelId)} className="size-5 shrink-0" />
              <PanelFacts s={s} />
            </label>
          ))}
        </fieldset>
        {problem ? <Alert tone="error">{problem}</Alert> : null}
        <TextField label="Your name" required hint="Your name here is your signature on the colour." autoComplete="name" error={formState.errors.name?.message} {...register("name")} />
        <div>
          <Button type="submit" size="lg" pending={formState.isSubmitting}>
            Approve this colour
          </Button>
        </div>
      </form>
    </section>
  );
}
