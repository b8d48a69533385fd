import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { createJobInputSchema } from "@shared/schemas/job.schema";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { FormActions } from "@/components/ui/form/form-actions";
import { SelectField } from "@/components/ui/form/select-field";
import { TextField } from "@/components/ui/form/text-field";
import { TextareaField } from "@/components/ui/form/textarea-field";

type JobFormInput = z.input<typeof createJobInputSchema>;
export type JobFormValues = z.output<typeof createJobInputSchema>;
type Option<Id> = { id: Id; name: string };

const FIELDS = ["customerId", "title", "dueDate", "assignedPainterId", "notes"] as const;
const emptyToNull = (v: unknown) => (v === "" || v === undefined ? null : v);

/** Create or edit a job's basics. The shared schema checks it here and again on the server. */
export function JobForm({
  customers,
  customersTruncated = false,
  painters,
  defaultValues,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  customers: Option<number>[];
  /** The pick list holds the first page only; say so. */
  customersTruncated?: boolean;
  painters: Option<string>[];
  defaultValues?: Partial<JobFormInput>;
  submitLabel: string;
  /** Rejects with the API error on failure; the form shows it. */
  onSubmit: (values: JobFormValues) => Promise<unknown>;
  onCancel?: () => void;
}) {
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    watch,
    formState: { errors, isSubmitting },
  } = useForm<JobFormInput, unknown, JobFormValues>({
    resolver: zodResolver(createJobInputSchema),
    defaultValues: { customerId: "", title: "", dueDate: null, assignedPainterId: null, notes: "", ...defaultValues },
  });

  const submit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      await onSubmit(values);
    } catch (error) {
      setProblem(applyServerErrors(error, setError, FIELDS));
    }
  });

  const customerChosen = Boolean(watch("customerId"));
  const customerError = errors.customerId ? (customerChosen ? errors.customerId.message : "Choose the customer") : undefined;

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5">
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      <SelectField
        label="Customer"
        required
        error={customerError}
        hint={customersTruncated ? "Only the first 100 customers by name are listed." : undefined}
        {...register("customerId")}
      >
        <option value="">Choose a customer…</option>
        {customers.map((c) => (
          <option key={c.id} value={c.id}>
            {c.name}
          </option>
        ))}
      </SelectField>
      <TextField
        label="Title"
        required
        placeholder="e.g. Tank and fenders, candy cobalt over silver"
        error={errors.title?.message}
        {...register("title")}
      />
      <div className="grid gap-5 sm:grid-cols-2">
        <TextField label="Due date" type="date" error={errors.dueDate?.message} {...register("dueDate", { setValueAs: emptyToNull })} />
        <SelectField label="Painter" error={errors.assignedPainterId?.message} {...register("assignedPainterId", { setValueAs: emptyToNull })}>
          <option value="">Not assigned yet</option>
          {painters.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </SelectField>
      </div>
      <TextareaField
        label="Notes"
        rows={4}
        hint="Shop-only: customers never see these."
        error={errors.notes?.message}
        {...register("notes")}
      />
      <FormActions>
        <Button type="submit" size="lg" pending={isSubmitting}>
          {submitLabel}
        </Button>
        {onCancel ? (
          <Button variant="ghost" size="lg" onClick={onCancel}>
            Cancel
          </Button>
        ) : null}
      </FormActions>
    </form>
  );
}
