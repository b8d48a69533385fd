import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { createPanelInputSchema } from "@shared/schemas/panel.schema";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { FormActions } from "@/components/ui/form/form-actions";
import { TextareaField } from "@/components/ui/form/textarea-field";
import { TextField } from "@/components/ui/form/text-field";

type PanelInput = z.input<typeof createPanelInputSchema>;
export type PanelValues = z.output<typeof createPanelInputSchema>;
const FIELDS = ["groundName", "candyName", "letDownClear", "letDownToner", "coats", "labL", "labA", "labB", "sprayedOn", "notes", "jobId"] as const;

/** How a test panel was made, and its optional colour-meter reading. */
export function PanelForm({
  defaultValues,
  grounds,
  candies,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  defaultValues?: Partial<PanelInput>;
  grounds: string[];
  candies: string[];
  submitLabel: string;
  onSubmit: (values: PanelValues) => Promise<unknown>;
  onCancel: () => void;
}) {
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<PanelInput, unknown, PanelValues>({
    resolver: zodResolver(createPanelInputSchema),
    defaultValues: { groundName: "", candyName: "", letDownClear: "6", letDownToner: "1", coats: "4", labL: "", labA: "", labB: "", sprayedOn: "", notes: "", ...defaultValues },
  });
  const submit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      await onSubmit(values);
    } catch (error) {
      setProblem(applyServerErrors(error, setError, FIELDS));
    }
  });
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5">
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Ground coat" required list="panel-grounds" placeholder="e.g. Fine silver" error={errors.groundName?.message} {...register("groundName")} />
        <TextField label="Candy" required list="panel-candies" placeholder="e.g. Apple red" error={errors.candyName?.message} {...register("candyName")} />
      </div>
      <datalist id="panel-grounds">{grounds.map((g) => <option key={g} value={g} />)}</datalist>
      <datalist id="panel-candies">{candies.map((c) => <option key={c} value={c} />)}</datalist>
      <fieldset className="grid grid-cols-[1fr_1fr_1fr] gap-3">
        <legend className="mb-1.5 text-sm font-semibold text-ink-950">Let-down (clear : toner) and coats</legend>
        <TextField label="Clear parts" required inputMode="decimal" error={errors.letDownClear?.message} {...register("letDownClear")} />
        <TextField label="Toner parts" required inputMode="decimal" error={errors.letDownToner?.message} {...register("letDownToner")} />
        <TextField label="Coats" required inputMode="numeric" error={errors.coats?.message} {...register("coats")} />
      </fieldset>
      <fieldset className="grid grid-cols-3 gap-3">
        <legend className="mb-1.5 text-sm font-semibold text-ink-950">Colour-meter reading (optional, all three or none)</legend>
        <TextField label="L*" inputMode="decimal" error={errors.labL?.message} {...register("labL")} />
        <TextField label="a*" inputMode="decimal" error={errors.labA?.message} {...register("labA")} />
        <TextField label="b*" inputMode="decimal" error={errors.labB?.message} {...register("labB")} />
      </fieldset>
      <TextField label="Sprayed on" type="date" error={errors.sprayedOn?.message} fieldClassName="max-w-xs" {...register("sprayedOn")} />
      <TextareaField label="Notes" rows={3} error={errors.notes?.message} {...register("notes")} />
      <FormActions>
        <Button type="submit" size="lg" pending={isSubmitting}>
          {submitLabel}
        </Button>
        <Button variant="ghost" size="lg" onClick={onCancel}>
          Cancel
        </Button>
      </FormActions>
    </form>
  );
}
