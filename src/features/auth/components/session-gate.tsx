import type { ReactNode } from "react";
import { Navigate, useLocation } from "react-router";
import { useSuspenseQuery } from "@tanstack/react-query";
import { roleCan, type Access } from "@shared/domain/roles";
import { homePathFor, paths } from "@/config/paths";
import { authQueries } from "../api/auth.queries";
import { CurrentUserContext } from "../hooks/use-current-user";

/**
 * Lets a signed-in user of the right role through, and provides them to everything inside.
 * Signed out (or the session just ended): to sign-in, remembering where they were.
 * Wrong role: to their own home (the staff app or the customer portal).
 */
export function SessionGate({ access, children }: { access: Access; children: ReactNode }) {
  const { data: user } = useSuspenseQuery(authQueries.me());
  const location = useLocation();
  if (!user) {
    const next = `${location.pathname}${location.search}`;
    return <Navigate to={`${paths.signIn}?next=${encodeURIComponent(next)}`} replace />;
  }
  if (!roleCan(user.role, access)) return <Navigate to={homePathFor(user.role)} replace />;
  return <CurrentUserContext value={user}>{children}</CurrentUserContext>;
}
