import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { changePasswordSchema, PASSWORD_MIN_LENGTH } from "@shared/schemas/auth.schema";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { FormActions } from "@/components/ui/form/form-actions";
import { PasswordField } from "@/components/ui/form/password-field";
import { useChangePassword } from "../api/auth.queries";

export function ChangePasswordForm() {
  const change = useChangePassword();
  const [done, setDone] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm<z.input<typeof changePasswordSchema>, unknown, z.output<typeof changePasswordSchema>>({
    resolver: zodResolver(changePasswordSchema),
    defaultValues: { currentPassword: "", newPassword: "" },
  });

  const onSubmit = handleSubmit(async (values) => {
    setProblem(null);
    setDone(null);
    try {
      const result = await change.mutateAsync(values);
      reset();
      setDone(result.message);
    } catch (error) {
      setProblem(applyServerErrors(error, setError, ["currentPassword", "newPassword"]));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex max-w-md flex-col gap-5">
      {done ? <Alert tone="success">{done}</Alert> : null}
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      <PasswordField
        label="Current password"
        autoComplete="current-password"
        required
        error={errors.currentPassword?.message}
        {...register("currentPassword")}
      />
      <PasswordField
        label="New password"
        autoComplete="new-password"
        required
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        error={errors.newPassword?.message}
        {...register("newPassword")}
      />
      <FormActions>
        <Button type="submit" pending={change.isPending}>
          Change password
        </Button>
      </FormActions>
    </form>
  );
}
