import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { passwordResetRequestSchema } from "@shared/schemas/auth.schema";
import { isApiError } from "@/lib/api-client";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/form/text-field";
import { useRequestPasswordReset } from "../api/auth.queries";

export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const [sent, setSent] = useState<string | null>(null);
  const [problem, setProblem] = useState<{ tone: "error" | "warning"; message: string } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    getValues,
    formState: { errors },
  } = useForm<z.input<typeof passwordResetRequestSchema>, unknown, z.output<typeof passwordResetRequestSchema>>({
    resolver: zodResolver(passwordResetRequestSchema),
    defaultValues: { email: "" },
  });

  const onSubmit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      const result = await request.mutateAsync(values);
      setSent(result.message);
    } catch (error) {
      if (isApiError(error) && error.status === 429) setProblem({ tone: "warning", message: error.message });
      else setProblem({ tone: "error", message: applyServerErrors(error, setError, ["email"]) });
    }
  });

  if (sent)
    return (
      <Alert tone="success" title="Check your e-mail">
        <p>{sent}</p>
        <p className="mt-1">
          The link was sent to <strong>{getValues("email")}</strong> if it belongs to an account. It works once, for an hour.
        </p>
      </Alert>
    );

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {problem ? <Alert tone={problem.tone}>{problem.message}</Alert> : null}
      <TextField
        label="Email"
        type="email"
        autoComplete="email"
        inputMode="email"
        autoCapitalize="none"
        spellCheck={false}
        required
        error={errors.email?.message}
        {...register("email")}
      />
      <Button type="submit" size="lg" block pending={request.isPending}>
        Send reset link
      </Button>
    </form>
  );
}
