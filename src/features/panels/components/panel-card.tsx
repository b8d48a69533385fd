import { Link } from "react-router";
import { Check, Plus } from "lucide-react";
import type { PanelDto } from "@shared/schemas/panel.schema";
import { cn } from "@/utils/cn";
import { formatLab, PanelSwatch } from "./panel-swatch";
import { VerdictBadge } from "./verdict-badge";

/** One panel in the library grid, with a compare toggle (a real button: no hover-only controls). */
export function PanelCard({ panel, href, selected, onToggleCompare }: { panel: PanelDto; href: string; selected?: boolean; onToggleCompare?: () => void }) {
  return (
    <li className={cn("flex flex-col gap-2 rounded-xl border-2 bg-white p-3 shadow-card", selected ? "border-candy-600" : "border-primer-200")}>
      <Link to={href} className="flex flex-col gap-2 rounded-lg">
        <PanelSwatch panel={panel} />
        <span className="text-base leading-snug font-semibold text-ink-950">{panel.label}</span>
      </Link>
      <p className="text-xs text-primer-800 tabular-nums">{formatLab(panel.lab)}</p>
      {panel.jobTitle ? <p className="truncate text-xs text-primer-800">For: {panel.jobTitle}</p> : null}
      {panel.isApprovedForJob ? <p className="text-xs font-semibold text-emerald-900">Approved colour of its job</p> : null}
      {panel.vsApproved ? <VerdictBadge verdict={panel.vsApproved.verdict} deltaE={panel.vsApproved.deltaE} text={panel.vsApproved.text} /> : null}
      {onToggleCompare ? (
        <button
          type="button"
          aria-pressed={!!selected}
          onClick={onToggleCompare}
          className={cn(
            "mt-auto inline-flex min-h-11 items-center justify-center gap-1.5 rounded-lg border text-sm font-semibold",
            selected ? "border-candy-600 bg-candy-50 text-candy-900" : "border-primer-300 bg-white text-ink-950",
          )}
        >
          {selected ? <Check aria-hidden className="size-4" /> : <Plus aria-hidden className="size-4" />}
          Compare<span className="sr-only"> {panel.label}</span>
        </button>
      ) : null}
    </li>
  );
}
