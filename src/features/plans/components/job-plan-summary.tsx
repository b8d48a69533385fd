import { useQuery } from "@tanstack/react-query";
import { Layers } from "lucide-react";
import { LAYER_KIND_LABELS } from "@shared/domain/layers";
import { formatCents } from "@shared/quote/money";
import { ButtonLink } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { Spinner } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { formatVolume } from "@/utils/format-quantity";
import { planQueries } from "../api/plans.queries";

/** The job page's view of its finish plan: the layer stack in brief, the estimate, and the way in. */
export function JobPlanSummary({ jobId }: { jobId: number }) {
  const { data, isPending } = useQuery(planQueries.jobPlan(jobId));
  const plan = data?.plan;
  const estimate = data?.estimate;
  return (
    <Panel
      title="Finish plan"
      titleId="job-plan-heading"
      actions={
        // The link's look depends on whether a plan exists, so it waits for the answer: a control never changes
        // colour under the user (or an accessibility check) when its data arrives.
        isPending ? (
          <span aria-hidden className="inline-block h-11 w-48 rounded-lg border border-dashed border-primer-300" />
        ) : (
          <ButtonLink variant={plan ? "primary" : "secondary"} to={paths.jobPlan(jobId)} icon={<Layers aria-hidden className="size-4" />}>
            {plan ? "Plan and mix sheets" : "Plan this job"}
          </ButtonLink>
        )
      }
    >
      {isPending ? (
        <Spinner />
      ) : !plan ? (
        <p className="text-primer-700">No finish plan yet.</p>
      ) : (
        <div className="flex flex-col gap-3">
          <p>
            <span className="font-semibold">{plan.name}</span> <span className="text-primer-700">· version {plan.latest.version}</span>
          </p>
          <ol className="flex flex-wrap gap-1.5" aria-label="Layers">
            {plan.latest.layers.map((l) => (
              <li key={l.id} className="rounded-full bg-ink-50 px-2.5 py-1 text-xs font-semibold text-ink-800">
                {l.position}. {l.name || LAYER_KIND_LABELS[l.kind]}
              </li>
            ))}
          </ol>
          {estimate && estimate.totalVolumeMl > 0 ? (
            <p className="text-sm text-primer-800">
              About {formatVolume(estimate.totalVolumeMl)} ready to spray
              {estimate.totalCostCents !== undefined ? `, ${formatCents(estimate.totalCostCents)} of materials` : ""}.
            </p>
          ) : null}
        </div>
      )}
    </Panel>
  );
}
