import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { ROLE_LABELS, ROLES } from "@shared/domain/roles";
import { updateUserInputSchema, type UserDto } from "@shared/schemas/user.schema";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { FormActions } from "@/components/ui/form/form-actions";
import { SelectField } from "@/components/ui/form/select-field";
import { TextField } from "@/components/ui/form/text-field";
import { ROLE_HINTS } from "./create-user-form";
import { emptyToNull } from "@/lib/form-values";

type EditUserInput = z.input<typeof updateUserInputSchema>;
export type EditUserValues = z.output<typeof updateUserInputSchema>;

const FIELDS = ["name", "role", "customerId"] as const;

/** Name, role and (for customer accounts) the customer record. Changing a role signs that user out everywhere. */
export function EditUserForm({
  user,
  customers,
  isSelf,
  onSubmit,
  onCancel,
}: {
  user: UserDto;
  customers: { id: number; name: string }[];
  isSelf: boolean;
  onSubmit: (values: EditUserValues) => Promise<unknown>;
  onCancel: () => void;
}) {
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    watch,
    formState: { errors, isSubmitting },
  } = useForm<EditUserInput, unknown, EditUserValues>({
    resolver: zodResolver(updateUserInputSchema),
    defaultValues: { name: user.name, role: user.role, customerId: user.customerId },
  });
  const role = watch("role");
  const customerOptions =
    user.customerId && !customers.some((c) => c.id === user.customerId)
      ? [{ id: user.customerId, name: user.customerName ?? `Customer #${user.customerId}` }, ...customers]
      : customers;

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
      <SelectField
        label="Role"
        required
        disabled={isSelf}
        hint={isSelf ? "You cannot change your own role." : role ? `${ROLE_HINTS[role]} Changing the role signs them out.` : undefined}
        error={errors.role?.message}
        {...register("role")}
      >
        {ROLES.map((r) => (
          <option key={r} value={r}>
            {ROLE_LABELS[r]}
          </option>
        ))}
      </SelectField>
      {role === "customer" ? (
        <SelectField label="Customer record" required error={errors.customerId?.message} {...register("customerId", { setValueAs: emptyToNull })}>
          <option value="">Choose the customer…</option>
          {customerOptions.map((c) => (
            <option key={c.id} value={c.id}>
              {c.name}
            </option>
          ))}
        </SelectField>
      ) : null}
      <FormActions>
        <Button type="submit" size="lg" pending={isSubmitting}>
          Save user
        </Button>
        <Button variant="ghost" size="lg" onClick={onCancel}>
          Cancel
        </Button>
      </FormActions>
    </form>
  );
}
