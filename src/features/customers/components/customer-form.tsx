import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { createCustomerInputSchema } from "@shared/schemas/customer.schema";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { FormActions } from "@/components/ui/form/form-actions";
import { TextField } from "@/components/ui/form/text-field";
import { TextareaField } from "@/components/ui/form/textarea-field";

type CustomerFormInput = z.input<typeof createCustomerInputSchema>;
export type CustomerFormValues = z.output<typeof createCustomerInputSchema>;

const FIELDS = ["name", "email", "phone", "address", "notes"] as const;

export function CustomerForm({
  defaultValues,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  defaultValues?: Partial<CustomerFormInput>;
  submitLabel: string;
  onSubmit: (values: CustomerFormValues) => Promise<unknown>;
  onCancel?: () => void;
}) {
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<CustomerFormInput, unknown, CustomerFormValues>({
    resolver: zodResolver(createCustomerInputSchema),
    defaultValues: { name: "", email: "", phone: "", address: "", notes: "", ...defaultValues },
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
      <TextField label="Name" required autoComplete="off" error={errors.name?.message} {...register("name")} />
      <div className="grid gap-5 sm:grid-cols-2">
        <TextField label="Email" type="email" inputMode="email" autoComplete="off" error={errors.email?.message} {...register("email")} />
        <TextField label="Phone" type="tel" inputMode="tel" autoComplete="off" error={errors.phone?.message} {...register("phone")} />
      </div>
      <TextareaField label="Address" rows={2} error={errors.address?.message} {...register("address")} />
      <TextareaField label="Notes" rows={3} hint="Shop-only." error={errors.notes?.message} {...register("notes")} />
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
