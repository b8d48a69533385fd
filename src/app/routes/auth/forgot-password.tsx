import { Link } from "react-router";
import { ArrowLeft } from "lucide-react";
import { ForgotPasswordForm } from "@/features/auth/components/forgot-password-form";
import { paths } from "@/config/paths";

export default function ForgotPasswordRoute() {
  return (
    <>
      <title>Forgot password · Coatwright</title>
      <h1 className="text-3xl font-bold tracking-tight text-ink-950">Forgot your password?</h1>
      <p className="mt-2 mb-8 text-primer-700">Enter the email you sign in with. We will send a link to choose a new password.</p>
      <ForgotPasswordForm />
      <Link to={paths.signIn} className="mt-8 inline-flex min-h-11 items-center gap-1.5 self-start text-sm font-semibold text-candy-700 hover:underline">
        <ArrowLeft aria-hidden className="size-4" />
        Back to sign in
      </Link>
    </>
  );
}
