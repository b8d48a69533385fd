import { useState } from "react";
import { Link } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { Layers, Plus } from "lucide-react";
import { roleCan } from "@shared/domain/roles";
import { LAYER_KIND_LABELS } from "@shared/domain/layers";
import { ButtonLink } from "@/components/ui/button";
import { SingleChoice } from "@/components/ui/choice-group";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { Spinner } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { formatDateTime } from "@/utils/format-date";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";
import { planQueries } from "@/features/plans/api/plans.queries";

export default function PlansRoute() {
  const user = useCurrentUser();
  const office = roleCan(user.role, "office");
  const [kind, setKind] = useState<"template" | "job">("template");
  const { data, isPending } = useQuery(planQueries.list(kind));
  return (
    <>
      <PageHeader
        title="Finish plans"
        description="Reusable templates, and the layer stack of each job."
        actions={
          office ? (
            <ButtonLink to={paths.newPlan} icon={<Plus aria-hidden className="size-5" />}>
              New template
            </ButtonLink>
          ) : null
        }
      />
      <SingleChoice
        label="Show"
        value={kind}
        onChange={setKind}
        options={[
          { value: "template", label: "Templates" },
          { value: "job", label: office ? "Job plans" : "My jobs' plans" },
        ]}
        className="mb-5"
      />
      {isPending ? (
        <Spinner label="Loading plans…" />
      ) : !data?.length ? (
        <EmptyState icon={<Layers aria-hidden />} title={kind === "template" ? "No templates yet" : "No job plans yet"}>
          {kind === "template" ? "A template is a layer stack to start job plans from." : "Start a job's plan from its page."}
        </EmptyState>
      ) : (
        <ul className="grid gap-3 md:grid-cols-2 xl:grid-cols-3" aria-label={kind === "template" ? "Templates" : "Job plans"}>
          {data.map((p) => (
            <li key={p.id}>
              <Link to={paths.plan(p.id)} className="flex h-full flex-col gap-2 rounded-xl border border-primer-200 bg-white p-4 shadow-card hover:border-ink-300">
                <span className="text-base font-semibold text-ink-950">{p.name}</span>
                {p.jobTitle ? <span className="text-sm text-primer-700">Job #{p.jobId}: {p.jobTitle}</span> : null}
                {p.description ? <span className="line-clamp-2 text-sm text-primer-700">{p.description}</span> : null}
                <span className="mt-auto flex flex-wrap gap-1">
                  {p.layerKinds.map((k, i) => (
                    <span key={i} className="rounded-full bg-ink-50 px-2 py-0.5 text-xs font-semibold text-ink-800">
                      {LAYER_KIND_LABELS[k]}
                    </span>
                  ))}
                </span>
                <span className="text-xs text-primer-700">
                  Version {p.latestVersion} · updated {formatDateTime(p.updatedAt)}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
