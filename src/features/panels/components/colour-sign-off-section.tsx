import { useState } from "react";
import { useForm } from "react-hook-form";
import { Send } from "lucide-react";
import { PANEL_SIGN_OFF_LABELS } from "@shared/domain/colour-sign-off";
import type { JobColourDto } from "@shared/schemas/panel.schema";
import type { SendPanelsInput } from "@shared/schemas/colour-sign-off.schema";
import { applyServerErrors } from "@/lib/form-errors";
import { TextField } from "@/components/ui/form/text-field";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextareaField } from "@/components/ui/form/textarea-field";
import { toast } from "@/components/ui/toast/toast-store";
import { formatDateTime } from "@/utils/format-date";
import { cn } from "@/utils/cn";
import { useSendPanels } from "../api/panels.queries";

type Values = { panelIds: string[]; message: string; target: { label: string; labL: string; labA: string; labB: string } };
const EMPTY_TARGET = { label: "", labL: "", labA: "", labB: "" };

/** The target the ΔE00 is measured to: the customer's sample when anything of it is entered, else none (the server then uses the agreed panel). */
const targetOf = (t: Values["target"]) => (Object.values(t).some((v) => v.trim()) ? (t as unknown as SendPanelsInput["target"]) : undefined);

/**
 * The customer's colour sign-off: pick the job's test panels to send (each goes with its photo, let-down, coats and
 * ΔE00 to the agreed colour), then follow what the customer answered in the portal.
 */
export function ColourSignOffSection({ colour, canSend }: { colour: JobColourDto; canSend: boolean }) {
  const send = useSendPanels();
  const [problem, setProblem] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, watch, formState } = useForm<Values>({
    defaultValues: { panelIds: [], message: "", target: EMPTY_TARGET },
  });
  const chosen = watch("panelIds");
  const submit = handleSubmit(async (values) => {
    setProblem(null);
    if (!values.panelIds.length) {
      setProblem("Tick at least one panel to send.");
      return;
    }
    try {
      await send.mutateAsync({ panelIds: values.panelIds.map(Number), message: values.message, target: targetOf(values.target) });
      toast.success(values.panelIds.length === 1 ? "Panel sent to the customer" : `${values.panelIds.length} panels sent to the customer`);
      reset();
    } catch (error) {
      setProblem(applyServerErrors(error, setError, ["message", "target.label", "target.labL", "target.labA", "target.labB"]));
    }
  });
  const latest = colour.signOffs.filter((s) => s.status !== "replaced");
  return (
    <div className="flex flex-col gap-3 border-t border-primer-200 pt-4">
      <h3 className="text-base font-semibold text-ink-950">Customer's sign-off</h3>
      {colour.approvedByCustomer ? (
        <p className="text-sm font-semibold text-emerald-900">The customer approved the agreed colour in the portal.</p>
      ) : colour.approvedPanel ? (
        <p className="text-sm text-primer-800">The agreed colour was set in the shop; the customer has not approved a panel in the portal.</p>
      ) : null}
      {latest.length ? (
        <ul className="flex flex-col gap-1 text-sm" aria-label="Panels sent to the customer">
          {latest.map((s) => (
            <li key={s.id} className="flex flex-wrap items-baseline gap-x-2">
              <span className="font-semibold text-ink-950">{s.label}</span>
              <span className={cn("rounded-full px-2 py-0.5 text-xs font-semibold", s.status === "approved" ? "bg-emerald-100 text-emerald-950" : s.status === "waiting" ? "bg-flake-100 text-flake-900" : "bg-primer-200 text-ink-950")}>
                {PANEL_SIGN_OFF_LABELS[s.status]}
              </span>
              <span className="text-primer-800">
                {s.deltaE != null && s.targetLabel ? `ΔE00 ${s.deltaE.toFixed(2)} to ${s.targetLabel}; ` : ""}
                sent {formatDateTime(s.sentAt)}
                {s.decidedAt && s.status === "approved" ? `; approved by ${s.decisionName} ${formatDateTime(s.decidedAt)}${s.decidedAddress ? ` from ${s.decidedAddress}` : ""}` : ""}
              </span>
            </li>
          ))}
        </ul>
      ) : null}
      {canSend && colour.panels.length ? (
        <form onSubmit={submit} noValidate aria-label="Send panels to the customer" className="flex flex-col gap-3">
          {problem ? <Alert tone="error">{problem}</Alert> : null}
          <fieldset className="flex flex-col gap-2">
            <legend className="mb-1 text-sm font-semibold text-ink-950">Panels to send</legend>
            {colour.panels.map((p) => (
              <label key={p.id} className="flex min-h-11 items-center gap-3 rounded-lg border border-primer-300 px-3 text-sm has-checked:border-candy-700 has-checked:bg-candy-50">
                <input type="checkbox" value={String(p.id)} className="size-5" {...register("panelIds")} />
                <span>
                  {p.label}
                  {p.photo ? "" : " (no photo yet)"}
                </span>
              </label>
            ))}
          </fieldset>
          <TextareaField label="Message to the customer (optional)" rows={2} error={formState.errors.message?.message} {...register("message")} />
          <fieldset className="flex flex-col gap-2">
            <legend className="mb-1 text-sm font-semibold text-ink-950">Target colour (optional)</legend>
            <p className="text-xs text-primer-800">The customer's sample as the meter read it; each panel's ΔE00 is measured to it. Left empty, the job's agreed panel is the target when it has one.</p>
            <div className="grid gap-2 sm:grid-cols-[minmax(0,1fr)_5rem_5rem_5rem]">
              <TextField label="Target name" placeholder="e.g. customer's sample chip" error={formState.errors.target?.label?.message} {...register("target.label")} />
              <TextField label="L*" inputMode="decimal" error={formState.errors.target?.labL?.message} {...register("target.labL")} />
              <TextField label="a*" inputMode="decimal" error={formState.errors.target?.labA?.message} {...register("target.labA")} />
              <TextField label="b*" inputMode="decimal" error={formState.errors.target?.labB?.message} {...register("target.labB")} />
            </div>
          </fieldset>
          <div>
            <Button type="submit" icon={<Send aria-hidden className="size-4" />} pending={formState.isSubmitting}>
              {chosen.length > 1 ? `Send ${chosen.length} panels to the customer` : "Send to the customer"}
            </Button>
          </div>
        </form>
      ) : null}
    </div>
  );
}
