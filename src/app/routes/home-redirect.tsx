import { Navigate } from "react-router";
import { useSuspenseQuery } from "@tanstack/react-query";
import { authQueries } from "@/features/auth/api/auth.queries";
import { homePathFor, paths } from "@/config/paths";

/** "/" sends each role to its start page, and signed-out visitors to sign-in. */
export function HomeRedirect() {
  const { data: user } = useSuspenseQuery(authQueries.me());
  return <Navigate to={user ? homePathFor(user.role) : paths.signIn} replace />;
}
