import { useQuery } from "@tanstack/react-query";
// A display piece shared with the staff panel screens (no queries, no staff screens behind it).
import { PanelSwatch } from "@/features/panels/components/panel-swatch";
import { portalQueries } from "../api/portal.queries";

/** For the customer: the colour they agreed, from its test panel. Renders nothing until one is approved. */
export function ApprovedColour({ jobId }: { jobId: number }) {
  const colour = useQuery(portalQueries.jobColour(jobId));
  const panel = colour.data?.approvedPanel;
  if (!panel) return null;
  return (
    <section aria-label={`Agreed colour of job #${jobId}`} className="flex items-center gap-3">
      <div className="size-16 shrink-0"><PanelSwatch panel={panel} /></div>
      <div>
        <h2 className="text-sm font-semibold text-ink-950">Agreed colour</h2>
        <p className="text-sm text-primer-800">{panel.label}</p>
      </div>
    </section>
  );
}
