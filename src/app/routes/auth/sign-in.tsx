import { Navigate, useSearchParams } from "react-router";
import { useSuspenseQuery } from "@tanstack/react-query";
import { authQueries } from "@/features/auth/api/auth.queries";
import { SignInForm } from "@/features/auth/components/sign-in-form";
import { homePathFor, safeNextPath } from "@/config/paths";

export default function SignInRoute() {
  const { data: user } = useSuspenseQuery(authQueries.me());
  const [searchParams] = useSearchParams();
  const next = safeNextPath(searchParams.get("next"));
  // Signed in already, or just now: on to where they were going.
  if (user) return <Navigate to={next ?? homePathFor(user.role)} replace />;
  return (
    <>
      <title>Sign in · Coatwright</title>
      <h1 className="text-3xl font-bold tracking-tight text-ink-950">Sign in</h1>
      <p className="mt-2 mb-8 text-primer-700">Your shop's jobs, finishes and mixes.</p>
      <SignInForm />
    </>
  );
}
