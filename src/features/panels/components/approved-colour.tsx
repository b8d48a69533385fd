import { useQuery } from "@tanstack/react-query";
import { panelQueries } from "../api/panels.queries";
import { PanelSwatch } from "./panel-swatch";

/** For the customer: the colour they agreed, from its test panel. Renders nothing until one is approved. */
export function ApprovedColour({ jobId }: { jobId: number }) {
  const colour = useQuery(panelQueries.jobColour(jobId));
  const panel = colour.data?.approvedPanel;
  if (!panel) return null;
  return (
    <section aria-label={`Agreed colour of job #${jobId}`} className="flex items-center gap-3">
      <div className="size-16 shrink-0"><PanelSwatch panel={panel} /></div>
      <div>
        <h4 className="text-sm font-semibold text-ink-950">Agreed colour</h4>
        <p className="text-sm text-primer-800">{panel.label}</p>
      </div>
    </section>
  );
}
