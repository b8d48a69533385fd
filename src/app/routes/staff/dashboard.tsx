import { useQuery } from "@tanstack/react-query";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";
import { Spinner } from "@/components/ui/spinner";
import { AccessGate } from "@/features/auth/components/access-gate";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";
import { dashboardQueries } from "@/features/dashboard/api/dashboard.queries";
import { DashboardView } from "@/features/dashboard/components/dashboard-view";

/** Its own chunk: recharts loads only with this screen. */
export default function DashboardRoute() {
  return (
    <AccessGate access="office">
      <DashboardPage />
    </AccessGate>
  );
}

function DashboardPage() {
  const user = useCurrentUser();
  const { data, isPending, error } = useQuery(dashboardQueries.summary());
  return (
    <>
      <PageHeader
        title="Dashboard"
        description={user.role === "owner" ? "Work in the shop, deposits, revenue, material spend and booth time." : "Work in the shop and what is coming due."}
      />
      {isPending ? <Spinner label="Loading the dashboard…" /> : error && !data ? <Alert tone="error">{error.message}</Alert> : data ? <DashboardView data={data} /> : null}
    </>
  );
}
