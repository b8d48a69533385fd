import { ROLE_LABELS } from "@shared/domain/roles";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { ChangePasswordForm } from "@/features/auth/components/change-password-form";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";

export default function AccountRoute() {
  const user = useCurrentUser();
  return (
    <>
      <PageHeader title="Account" />
      <div className="flex max-w-2xl flex-col gap-6">
        <Panel title="You" titleId="you-heading">
          <dl className="grid gap-4 sm:grid-cols-3">
            <div>
              <dt className="text-xs font-semibold tracking-wide text-primer-700 uppercase">Name</dt>
              <dd className="text-ink-950">{user.name}</dd>
            </div>
            <div className="min-w-0">
              <dt className="text-xs font-semibold tracking-wide text-primer-700 uppercase">Email</dt>
              <dd className="break-all text-ink-950">{user.email}</dd>
            </div>
            <div>
              <dt className="text-xs font-semibold tracking-wide text-primer-700 uppercase">Role</dt>
              <dd className="text-ink-950">{ROLE_LABELS[user.role]}</dd>
            </div>
          </dl>
        </Panel>
        <Panel title="Change password" titleId="password-heading">
          <p className="mb-5 text-sm text-primer-700">Changing it signs you out on every other device.</p>
          <ChangePasswordForm />
        </Panel>
      </div>
    </>
  );
}
