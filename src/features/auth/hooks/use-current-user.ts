import { createContext, useContext } from "react";
import type { SessionUser } from "@shared/schemas/auth.schema";

/** Filled by the access gate once the session is known; everything inside a signed-in layout can read it. */
export const CurrentUserContext = createContext<SessionUser | null>(null);

export function useCurrentUser(): SessionUser {
  const user = useContext(CurrentUserContext);
  if (!user) throw new Error("useCurrentUser is only available inside a signed-in layout");
  return user;
}
