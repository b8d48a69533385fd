import { useState } from "react";
import { Controller, useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { Send, Trash2 } from "lucide-react";
import { quoteLineSchema } from "@shared/schemas/quote.schema";
import { requiredText } from "@shared/schemas/common.schema";
import type { ChangeOrderDto } from "@shared/schemas/change-order.schema";
import type { QuoteLine } from "@shared/quote/index";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { MoneyField } from "@/components/ui/form/money-field";
import { TextField } from "@/components/ui/form/text-field";
import { TextareaField } from "@/components/ui/form/textarea-field";
import { toast } from "@/components/ui/toast/toast-store";
import { useSendChangeOrder, useUpdateChangeOrder } from "../api/change-orders.queries";

/** The draft's words and colour flag. */
const headSchema = z.object({ summary: requiredText(2000, "What changed"), colourChanged: z.boolean() });
/** One labour line added to the price difference (hours × rate, like a quote's labour line). */
const labourSchema = z.object({ description: requiredText(200, "Description"), hours: z.coerce.number({ error: "Hours must be a number" }).positive("Hours must be more than 0").max(1000), rateCents: z.number({ error: "Enter the rate" }).int().min(0) });

/**
 * The office prepares a draft change order: what changed in words, whether the colour changes, the price lines; then
 * sends it to the customer. Every save sends the version it was read at.
 */
export function ChangeOrderDraftForm({ co, labourRateCents }: { co: ChangeOrderDto; labourRateCents: number }) {
  const update = useUpdateChangeOrder(co.jobId);
  const send = useSendChangeOrder(co.jobId);
  const [problem, setProblem] = useState<string | null>(null);
  const head = useForm<z.input<typeof headSchema>, unknown, z.output<typeof headSchema>>({ resolver: zodResolver(headSchema), values: { summary: co.summary, colourChanged: co.colourChanged } });
  const line = useForm<z.input<typeof labourSchema>, unknown, z.output<typeof labourSchema>>({ resolver: zodResolver(labourSchema), defaultValues: { description: "", hours: "", rateCents: labourRateCents } });
  const lines = co.money?.lines ?? [];

  const save = async (changes: { summary?: string; colourChanged?: boolean; lines?: QuoteLine[] }) => {
    setProblem(null);
    try {
      await update.mutateAsync({ id: co.id, version: co.version, ...changes });
      return true;
    } catch (e) {
      setProblem(applyServerErrors(e, head.setError, ["summary", "colourChanged"]));
      return false;
    }
  };

  return (
    <div className="flex flex-col gap-4 border-t border-primer-200 pt-4">
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      <form aria-label={`Change order #${co.id}`} className="flex flex-col gap-3" onSubmit={head.handleSubmit((v) => save(v).then((ok) => ok && toast.success("Change order saved")))}>
        <TextareaField label="What changed, in words for the customer" required error={head.formState.errors.summary?.message} {...head.register("summary")} />
        <label className="flex min-h-11 items-center gap-2 text-sm font-semibold text-ink-950">
          <input type="checkbox" className="size-5" {...head.register("colourChanged")} />
          The colour changes (the customer approves a new test panel)
        </label>
        <Button type="submit" variant="secondary" pending={update.isPending} className="self-start">
          Save the change order
        </Button>
      </form>
      {lines.length ? (
        <ul className="flex flex-col gap-1 text-sm">
          {lines.map((l, i) => (
            <li key={i} className="flex items-center justify-between gap-2">
              <span>{l.description}</span>
              <Button variant="ghost" size="sm" aria-label={`Remove the line ${l.description}`} icon={<Trash2 aria-hidden className="size-4" />} onClick={() => save({ lines: lines.filter((_, j) => j !== i) })} />
            </li>
          ))}
        </ul>
      ) : null}
      <form
        aria-label="Add a labour line"
        className="grid gap-3 sm:grid-cols-[1fr_6rem_8rem_auto] sm:items-end"
        onSubmit={line.handleSubmit(async (v) => {
          const added = quoteLineSchema.parse({ kind: "labour", ...v }) as QuoteLine;
          if (await save({ lines: [...lines, added] })) line.reset({ description: "", hours: "", rateCents: labourRateCents });
        })}
      >
        <TextField label="Labour line" error={line.formState.errors.description?.message} {...line.register("description")} />
        <TextField label="Hours" inputMode="decimal" error={line.formState.errors.hours?.message} {...line.register("hours")} />
        <Controller control={line.control} name="rateCents" render={({ field, fieldState }) => <MoneyField label="Rate" suffix="/h" value={field.value} onChange={field.onChange} onBlur={field.onBlur} error={fieldState.error?.message} />} />
        <Button type="submit" variant="secondary" pending={update.isPending}>
          Add line
        </Button>
      </form>
      <Button
        className="self-start"
        pending={send.isPending}
        icon={<Send aria-hidden className="size-4" />}
        onClick={async () => {
          setProblem(null);
          try {
            await send.mutateAsync({ id: co.id });
            toast.success("Sent to the customer");
          } catch (e) {
            setProblem(applyServerErrors(e, head.setError, []));
          }
        }}
      >
        Send to the customer
      </Button>
    </div>
  );
}
