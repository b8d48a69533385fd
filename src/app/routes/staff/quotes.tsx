import { PageHeader } from "@/components/ui/page-header";
import { AccessGate } from "@/features/auth/components/access-gate";
import { QuotesTable } from "@/features/quotes/components/quotes-table";

export default function QuotesRoute() {
  return (
    <AccessGate access="office">
      <PageHeader title="Quotes" description="Every quote and where it stands. Start a new one from a job's page." />
      <QuotesTable />
    </AccessGate>
  );
}
