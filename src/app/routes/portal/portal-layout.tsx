import { Outlet } from "react-router";
import { PortalShell } from "@/components/layouts/portal-shell";
import { PORTAL_NAV } from "@/config/portal-nav";
import { SessionGate } from "@/features/auth/components/session-gate";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";
import { ScreenBoundary } from "../screen-boundary";
import { useSignOutAction } from "../use-sign-out-action";

export default function PortalLayout() {
  return (
    <SessionGate access="customer">
      <PortalFrame />
    </SessionGate>
  );
}

function PortalFrame() {
  const user = useCurrentUser();
  const { signOut, signingOut } = useSignOutAction();
  return (
    <PortalShell nav={PORTAL_NAV} userName={user.name} onSignOut={signOut} signingOut={signingOut}>
      <ScreenBoundary>
        <Outlet />
      </ScreenBoundary>
    </PortalShell>
  );
}
