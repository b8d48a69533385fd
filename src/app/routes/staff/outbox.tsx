import { PageHeader } from "@/components/ui/page-header";
import { AccessGate } from "@/features/auth/components/access-gate";
import { OutboxView } from "@/features/outbox/components/outbox-view";

export default function OutboxRoute() {
  return (
    <AccessGate access="owner">
      <PageHeader title="Outbox" description="Demo mode: mail this server would have sent is kept here instead of leaving the building." />
      <OutboxView />
    </AccessGate>
  );
}
