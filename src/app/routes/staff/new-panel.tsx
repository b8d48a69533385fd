import { useQuery } from "@tanstack/react-query";
import { useNavigate, useSearchParams } from "react-router";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { toast } from "@/components/ui/toast/toast-store";
import { paths } from "@/config/paths";
import { jobQueries } from "@/features/jobs/api/jobs.queries";
import { panelQueries, useCreatePanel } from "@/features/panels/api/panels.queries";
import { PanelForm } from "@/features/panels/components/panel-form";
import { VerdictBadge } from "@/features/panels/components/verdict-badge";

/** Record a sprayed panel; from a job, the panel is made for that job and compared with its approved colour. */
export default function NewPanelRoute() {
  const [params] = useSearchParams();
  const jobId = Number(params.get("jobId")) || null;
  const job = useQuery({ ...jobQueries.detail(jobId ?? 0), enabled: !!jobId });
  const facets = useQuery(panelQueries.list({ pageSize: 1 }));
  const create = useCreatePanel();
  const navigate = useNavigate();
  return (
    <>
      <PageHeader title="New test panel" description={job.data ? `Made for job #${job.data.id}: ${job.data.title}` : "Record how the panel was made; add its photo next."} />
      <Panel className="max-w-3xl">
        <PanelForm
          grounds={facets.data?.facets.grounds ?? []}
          candies={facets.data?.facets.candies ?? []}
          defaultValues={jobId ? { jobId } : undefined}
          submitLabel="Save panel"
          onCancel={() => navigate(-1)}
          onSubmit={async (values) => {
            const panel = await create.mutateAsync(values);
            if (panel.vsApproved) toast.info(`${panel.vsApproved.text}`);
            else toast.success("Panel saved; add its photo");
            navigate(paths.panel(panel.id), { replace: true });
          }}
        />
      </Panel>
      {create.data?.vsApproved ? <VerdictBadge verdict={create.data.vsApproved.verdict} deltaE={create.data.vsApproved.deltaE} /> : null}
    </>
  );
}
