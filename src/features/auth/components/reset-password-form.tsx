import { useState } from "react";
import { Link } from "react-router";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { PASSWORD_MIN_LENGTH, passwordResetConfirmSchema } from "@shared/schemas/auth.schema";
import { isApiError } from "@/lib/api-client";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button, ButtonLink } from "@/components/ui/button";
import { PasswordField } from "@/components/ui/form/password-field";
import { paths } from "@/config/paths";
import { useConfirmPasswordReset } from "../api/auth.queries";

/** Sets a new password with the token from the e-mailed link. */
export function ResetPasswordForm({ token }: { token: string }) {
  const confirm = useConfirmPasswordReset();
  const [done, setDone] = useState<string | null>(null);
  const [problem, setProblem] = useState<{ message: string; badToken: boolean } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<z.input<typeof passwordResetConfirmSchema>, unknown, z.output<typeof passwordResetConfirmSchema>>({
    resolver: zodResolver(passwordResetConfirmSchema),
    defaultValues: { token, password: "" },
  });

  const onSubmit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      const result = await confirm.mutateAsync(values);
      setDone(result.message);
    } catch (error) {
      const badToken = isApiError(error) && "token" in error.fields;
      setProblem({ message: applyServerErrors(error, setError, ["password"]), badToken });
    }
  });

  if (done)
    return (
      <div className="flex flex-col gap-5">
        <Alert tone="success" title="Password changed">
          {done}
        </Alert>
        <ButtonLink to={paths.signIn} size="lg" block>
          Go to sign in
        </ButtonLink>
      </div>
    );

  const tokenError = errors.token?.message;
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {problem || tokenError ? (
        <Alert tone="error">
          <p>{problem?.message ?? tokenError}</p>
          {problem?.badToken || tokenError ? (
            <p className="mt-1">
              <Link to={paths.forgotPassword} className="font-semibold underline underline-offset-2">
                Ask for a new link
              </Link>
            </p>
          ) : null}
        </Alert>
      ) : null}
      <input type="hidden" {...register("token")} />
      <PasswordField
        label="New password"
        autoComplete="new-password"
        required
        hint={`At least ${PASSWORD_MIN_LENGTH} characters. A few unrelated words work well.`}
        error={errors.password?.message}
        {...register("password")}
      />
      <Button type="submit" size="lg" block pending={confirm.isPending}>
        Set new password
      </Button>
    </form>
  );
}
