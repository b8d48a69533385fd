import { useQuery } from "@tanstack/react-query";
import { Link } from "react-router";
import { BadgeCheck, Plus } from "lucide-react";
import { Alert } from "@/components/ui/alert";
import { Button, ButtonLink } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { toast } from "@/components/ui/toast/toast-store";
import { panelQueries, useSetApprovedPanel } from "../api/panels.queries";
import { formatLab, PanelSwatch } from "./panel-swatch";
import { VerdictBadge } from "./verdict-badge";
import { ColourSignOffSection } from "./colour-sign-off-section";

/** A job's agreed colour: the approved panel, and each panel made for the job with its ΔE00 against it. */
export function JobColourPanel({ jobId, canApprove, panelHref, newPanelHref }: { jobId: number; canApprove: boolean; panelHref: (id: number) => string; newPanelHref?: string }) {
  const colour = useQuery(panelQueries.jobColour(jobId));
  const approve = useSetApprovedPanel(jobId);
  return (
    <Panel
      title="Colour"
      titleId="job-colour-heading"
      actions={newPanelHref ? <ButtonLink to={newPanelHref} variant="secondary" icon={<Plus aria-hidden className="size-4" />}>New test panel</ButtonLink> : undefined}
    >
      {colour.isPending ? (
        <p className="text-sm text-primer-700">Loading…</p>
      ) : colour.error ? (
        <Alert tone="error">{colour.error.message}</Alert>
      ) : (
        <div className="flex flex-col gap-4">
          {colour.data.approvedPanel ? (
            <div className="flex items-center gap-4">
              <div className="size-24 shrink-0"><PanelSwatch panel={colour.data.approvedPanel} /></div>
              <div>
                <p className="flex items-center gap-1.5 text-sm font-semibold text-emerald-900">
                  <BadgeCheck aria-hidden className="size-5" />
                  Approved colour
                </p>
                <Link to={panelHref(colour.data.approvedPanel.id)} className="text-base font-semibold text-ink-950 underline underline-offset-2">
                  {colour.data.approvedPanel.label}
                </Link>
                <p className="text-xs text-primer-800 tabular-nums">{formatLab(colour.data.approvedPanel.lab)}</p>
              </div>
            </div>
          ) : (
            <p className="text-base text-primer-800">No colour approved yet{canApprove ? ": approve one of the job's test panels below" : ""}.</p>
          )}
          {colour.data.panels.filter((p) => !p.isApprovedForJob).length ? (
            <ul className="flex flex-col divide-y divide-primer-200">
              {colour.data.panels
                .filter((p) => !p.isApprovedForJob)
                .map((p) => (
                  <li key={p.id} className="flex flex-wrap items-center gap-3 py-2">
                    <div className="size-14 shrink-0"><PanelSwatch panel={p} /></div>
                    <div className="min-w-0 flex-1">
                      <Link to={panelHref(p.id)} className="text-sm font-semibold text-ink-950 underline underline-offset-2">
                        {p.label}
                      </Link>
                      <p className="text-xs text-primer-800">{p.vsApproved ? p.vsApproved.text : colour.data.approvedPanel ? "No reading to compare" : formatLab(p.lab)}</p>
                    </div>
                    {p.vsApproved ? <VerdictBadge verdict={p.vsApproved.verdict} deltaE={p.vsApproved.deltaE} /> : null}
                    {canApprove ? (
                      <Button
                        variant="secondary"
                        pending={approve.isPending && approve.variables === p.id}
                        onClick={() => approve.mutate(p.id, { onSuccess: () => toast.success("Approved colour changed"), onError: (e) => toast.error(e.message) })}
                      >
                        Approve<span className="sr-only"> {p.label}</span>
                      </Button>
                    ) : null}
                  </li>
                ))}
            </ul>
          ) : null}
          <ColourSignOffSection colour={colour.data} canSend={canApprove} />
        </div>
      )}
    </Panel>
  );
}
