import { Link, useSearchParams } from "react-router";
import { ArrowLeft } from "lucide-react";
import { Alert } from "@/components/ui/alert";
import { ButtonLink } from "@/components/ui/button";
import { ResetPasswordForm } from "@/features/auth/components/reset-password-form";
import { paths } from "@/config/paths";

export default function ResetPasswordRoute() {
  const [searchParams] = useSearchParams();
  const token = searchParams.get("token") ?? "";
  return (
    <>
      <title>Choose a new password · Coatwright</title>
      <h1 className="text-3xl font-bold tracking-tight text-ink-950">Choose a new password</h1>
      <p className="mt-2 mb-8 text-primer-700">This signs you out on every other device.</p>
      {token ? (
        <ResetPasswordForm token={token} />
      ) : (
        <div className="flex flex-col gap-5">
          <Alert tone="error" title="This link is missing its reset code">
            Open the link from the e-mail again, or ask for a new one.
          </Alert>
          <ButtonLink to={paths.forgotPassword} size="lg" block>
            Ask for a new link
          </ButtonLink>
        </div>
      )}
      <Link to={paths.signIn} className="mt-8 inline-flex min-h-11 items-center gap-1.5 self-start text-sm font-semibold text-candy-700 hover:underline">
        <ArrowLeft aria-hidden className="size-4" />
        Back to sign in
      </Link>
    </>
  );
}
