import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { ROLE_LABELS, ROLES } from "@shared/domain/roles";
import { PASSWORD_MIN_LENGTH } from "@shared/schemas/auth.schema";
import { createUserInputSchema } from "@shared/schemas/user.schema";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { FormActions } from "@/components/ui/form/form-actions";
import { PasswordField } from "@/components/ui/form/password-field";
import { SelectField } from "@/components/ui/form/select-field";
import { TextField } from "@/components/ui/form/text-field";
import { emptyToNull } from "@/lib/form-values";

type UserFormInput = z.input<typeof createUserInputSchema>;
export type CreateUserValues = z.output<typeof createUserInputSchema>;

const FIELDS = ["email", "name", "role", "password", "customerId"] as const;

export const ROLE_HINTS: Record<(typeof ROLES)[number], string> = {
  owner: "Everything, including users and shop settings.",
  estimator: "Customers, jobs, plans and quotes.",
  painter: "Their assigned jobs, at the booth. No prices.",
  customer: "Only their own jobs, in the customer portal.",
};

export function CreateUserForm({
  customers,
  onSubmit,
  onCancel,
}: {
  customers: { id: number; name: string }[];
  onSubmit: (values: CreateUserValues) => Promise<unknown>;
  onCancel: () => void;
}) {
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    watch,
    formState: { errors, isSubmitting },
  } = useForm<UserFormInput, unknown, CreateUserValues>({
    resolver: zodResolver(createUserInputSchema),
    defaultValues: { email: "", name: "", role: "painter", password: "", customerId: null },
  });
  const role = watch("role");

  const submit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      await onSubmit({ ...values, customerId: values.role === "customer" ? values.customerId : null });
    } catch (error) {
      setProblem(applyServerErrors(error, setError, FIELDS));
    }
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5">
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      <TextField label="Name" required autoComplete="off" error={errors.name?.message} {...register("name")} />
      <TextField
        label="Email"
        type="email"
        required
        inputMode="email"
        autoCapitalize="none"
        autoComplete="off"
        error={errors.email?.message}
        {...register("email")}
      />
      <SelectField label="Role" required hint={role ? ROLE_HINTS[role] : undefined} error={errors.role?.message} {...register("role")}>
        {ROLES.map((r) => (
          <option key={r} value={r}>
            {ROLE_LABELS[r]}
          </option>
        ))}
      </SelectField>
      {role === "customer" ? (
        <SelectField
          label="Customer record"
          required
          hint="The portal shows this customer's jobs."
          error={errors.customerId?.message}
          {...register("customerId", { setValueAs: emptyToNull })}
        >
          <option value="">Choose the customer…</option>
          {customers.map((c) => (
            <option key={c.id} value={c.id}>
              {c.name}
            </option>
          ))}
        </SelectField>
      ) : null}
      <PasswordField
        label="First password"
        required
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters. Tell them to change it under Account.`}
        error={errors.password?.message}
        {...register("password")}
      />
      <FormActions>
        <Button type="submit" size="lg" pending={isSubmitting}>
          Create user
        </Button>
        <Button variant="ghost" size="lg" onClick={onCancel}>
          Cancel
        </Button>
      </FormActions>
    </form>
  );
}
