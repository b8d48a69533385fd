import type { ReactNode } from "react";
import { Lock } from "lucide-react";
import { roleCan, ROLE_LABELS, type Access } from "@shared/domain/roles";
import { ButtonLink } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { homePathFor } from "@/config/paths";
import { useCurrentUser } from "../hooks/use-current-user";

/** Inside the signed-in app: shows the page only to roles in `access`; others get a plain explanation. */
export function AccessGate({ access, children }: { access: Access; children: ReactNode }) {
  const user = useCurrentUser();
  if (roleCan(user.role, access)) return children;
  return (
    <>
      <PageHeader title="Not available" />
      <EmptyState
        icon={<Lock aria-hidden />}
        title={`This page is not part of the ${ROLE_LABELS[user.role].toLowerCase()} view`}
        action={<ButtonLink to={homePathFor(user.role)}>Go to my start page</ButtonLink>}
      >
        Ask the shop owner if you need it.
      </EmptyState>
    </>
  );
}
