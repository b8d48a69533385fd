import { useNavigate, useSearchParams } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { Panel } from "@/components/ui/panel";
import { PageHeader } from "@/components/ui/page-header";
import { Spinner } from "@/components/ui/spinner";
import { toast } from "@/components/ui/toast/toast-store";
import { paths } from "@/config/paths";
import { canGoBack } from "@/utils/can-go-back";
import { AccessGate } from "@/features/auth/components/access-gate";
import { customerQueries } from "@/features/customers/api/customers.queries";
import { useCreateJob } from "@/features/jobs/api/jobs.queries";
import { JobForm } from "@/features/jobs/components/job-form";
import { userQueries } from "@/features/users/api/users.queries";

export default function NewJobRoute() {
  return (
    <AccessGate access="office">
      <NewJobPage />
    </AccessGate>
  );
}

function NewJobPage() {
  const navigate = useNavigate();
  const [searchParams] = useSearchParams();
  const painters = useQuery(userQueries.painters());
  const createJob = useCreateJob();
  const preselectedId = Number(searchParams.get("customer"));
  const preselected = Number.isInteger(preselectedId) && preselectedId > 0 ? preselectedId : null;
  const customer = useQuery({ ...customerQueries.detail(preselected ?? 0), enabled: preselected != null });

  return (
    <>
      <PageHeader title="New job" description="It starts as an inquiry. Add the parts to paint once it is created." />
      <Panel className="max-w-2xl">
        {painters.isPending || (preselected != null && customer.isPending) ? (
          <Spinner label="Loading painters…" />
        ) : (
          <JobForm
            customerSearch={customerQueries.search}
            customerName={customer.data?.name ?? null}
            painters={painters.data ?? []}
            defaultValues={{ customerId: customer.data ? String(customer.data.id) : "" }}
            submitLabel="Create job"
            onCancel={() => (canGoBack() ? navigate(-1) : navigate(paths.jobs))}
            onSubmit={async (values) => {
              const job = await createJob.mutateAsync(values);
              toast.success(`Created job #${job.id}`);
              navigate(paths.job(job.id));
            }}
          />
        )}
      </Panel>
    </>
  );
}
