import { useQuery } from "@tanstack/react-query";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";
import { Spinner } from "@/components/ui/spinner";
import { toast } from "@/components/ui/toast/toast-store";
import { AccessGate } from "@/features/auth/components/access-gate";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";
import { VocLimitsNote } from "@/features/compliance/components/voc-notes";
import { settingsQueries, useUpdateSettings } from "@/features/settings/api/settings.queries";
import { SettingsForm } from "@/features/settings/components/settings-form";
import { GunsPanel } from "@/features/guns/components/guns-panel";
import { BoothsPanel } from "@/features/schedule/components/booths-panel";

export default function SettingsRoute() {
  return (
    <AccessGate access="office">
      <SettingsPage />
    </AccessGate>
  );
}

function SettingsPage() {
  const user = useCurrentUser();
  const canEdit = user.role === "owner";
  const { data, isPending, error } = useQuery(settingsQueries.full());
  const update = useUpdateSettings();
  return (
    <>
      <PageHeader
        title="Settings"
        description={canEdit ? "Rates, quote terms, units and the shop's own VOC limits. Changes are recorded in the audit trail." : "The shop's rates, terms, units and VOC limits. Only the owner can change them."}
      />
      {!canEdit ? (
        <Alert tone="info" className="mb-6">
          You can read these settings; the owner changes them.
        </Alert>
      ) : null}
      {isPending ? (
        <Spinner label="Loading settings…" />
      ) : error && !data ? (
        <Alert tone="error">{error.message}</Alert>
      ) : data ? (
        <SettingsForm
          settings={data}
          canEdit={canEdit}
          limitsNote={<VocLimitsNote />}
          onSubmit={async (values) => {
            const saved = await update.mutateAsync({ ...values, version: data.version });
            toast.success("Settings saved");
            return saved;
          }}
        />
      ) : null}
      <div className="mt-8 max-w-3xl">
        <GunsPanel />
      </div>
      {user.role === "owner" ? (
        <div className="mt-8 max-w-3xl">
          <BoothsPanel />
        </div>
      ) : null}
    </>
  );
}
