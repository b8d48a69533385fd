import { useState } from "react";
import { Link } from "react-router";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { signInInputSchema } from "@shared/schemas/auth.schema";
import { isApiError } from "@/lib/api-client";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { PasswordField } from "@/components/ui/form/password-field";
import { TextField } from "@/components/ui/form/text-field";
import { paths } from "@/config/paths";
import { useSignIn } from "../api/auth.queries";

type Problem = { kind: "rate-limit" | "error"; message: string };

/** Signs in; the page around it moves on once the session exists. */
export function SignInForm() {
  const signIn = useSignIn();
  const [problem, setProblem] = useState<Problem | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<z.input<typeof signInInputSchema>, unknown, z.output<typeof signInInputSchema>>({
    resolver: zodResolver(signInInputSchema),
    defaultValues: { email: "", password: "" },
  });

  const onSubmit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      await signIn.mutateAsync(values);
    } catch (error) {
      if (isApiError(error) && error.status === 429) setProblem({ kind: "rate-limit", message: error.message });
      else setProblem({ kind: "error", message: applyServerErrors(error, setError, ["email", "password"]) });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {problem?.kind === "rate-limit" ? (
        <Alert tone="warning" title="Sign-in is paused for now">
          <p>{problem.message}</p>
          <p className="mt-1">
            <Link to={paths.forgotPassword} className="font-semibold underline underline-offset-2">
              Reset the password
            </Link>{" "}
            if you have forgotten it.
          </p>
        </Alert>
      ) : problem ? (
        <Alert tone="error">{problem.message}</Alert>
      ) : null}
      <TextField
        label="Email"
        type="email"
        autoComplete="username"
        inputMode="email"
        autoCapitalize="none"
        spellCheck={false}
        required
        error={errors.email?.message}
        {...register("email")}
      />
      <PasswordField label="Password" autoComplete="current-password" required error={errors.password?.message} {...register("password")} />
      <div className="flex flex-col gap-4">
        <Button type="submit" size="lg" block pending={signIn.isPending}>
          Sign in
        </Button>
        <Link to={paths.forgotPassword} className="self-center rounded text-sm font-semibold text-candy-700 underline-offset-2 hover:underline">
          Forgot password?
        </Link>
      </div>
    </form>
  );
}
