import { Outlet } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { roleCan, ROLE_LABELS } from "@shared/domain/roles";
import { AppShell } from "@/components/layouts/app-shell";
import { STAFF_NAV } from "@/config/nav";
import { SessionGate } from "@/features/auth/components/session-gate";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";
import { serverStatusQueries } from "@/lib/server-status.queries";
import { paths } from "@/config/paths";
import { OfflineBanner } from "@/features/booth/components/offline-banner";
import { ScreenBoundary } from "../screen-boundary";
import { useSignOutAction } from "../use-sign-out-action";

export default function StaffLayout() {
  return (
    <SessionGate access="staff">
      <StaffFrame />
    </SessionGate>
  );
}

function StaffFrame() {
  const user = useCurrentUser();
  const { signOut, signingOut } = useSignOutAction();
  const demoMode = useQuery(serverStatusQueries.health()).data?.demoMode === true;
  const nav = STAFF_NAV.filter(
    (item) => !item.planned && roleCan(user.role, item.access) && (!item.roles || item.roles.includes(user.role)) && (!item.demoOnly || demoMode),
  );
  return (
    <AppShell nav={nav} userName={user.name} roleLabel={ROLE_LABELS[user.role]} onSignOut={signOut} signingOut={signingOut}>
      <ScreenBoundary>
        {user.role === "painter" ? <OfflineBanner boothPath={paths.booth} /> : null}
        <Outlet />
      </ScreenBoundary>
    </AppShell>
  );
}
