import { useQuery } from "@tanstack/react-query";
import { Link, useSearchParams } from "react-router";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";
import { TextField } from "@/components/ui/form/text-field";
import { Spinner } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { panelQueries } from "@/features/panels/api/panels.queries";
import { formatLab, PanelSwatch } from "@/features/panels/components/panel-swatch";
import { formatNumber } from "@/utils/format-quantity";

/**
 * One candy over one ground, ordered by depth (toner fraction × coats), not by the coat count: 3 coats at 6:1 are
 * deeper than 4 at 10:1. Each rung shows how many coats at one let-down give its depth (mix engine: equivalent coats).
 */
export default function PanelsLadderRoute() {
  const [params, setParams] = useSearchParams();
  const ground = params.get("ground") ?? "";
  const candy = params.get("candy") ?? "";
  const toClear = Number(params.get("toClear")) || undefined;
  const toToner = Number(params.get("toToner")) || undefined;
  const ratio = toClear && toToner ? { toClear, toToner } : {};
  const ladder = useQuery({ ...panelQueries.ladder({ ground, candy, ...ratio }), enabled: !!ground && !!candy });
  const set = (key: string, value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(key, value);
    else next.delete(key);
    setParams(next, { replace: true });
  };
  if (!ground || !candy) return <Alert tone="info">Choose a ground and a candy in the panel library first.</Alert>;
  return (
    <>
      <PageHeader title={`Depth ladder: ${candy} over ${ground}`} description="The same candy over the same ground, from the lightest to the deepest (coats turned into one let-down)." />
      <fieldset className="mb-5 flex flex-wrap items-end gap-3 rounded-xl border border-primer-200 bg-white p-4 shadow-card">
        <legend className="sr-only">Let-down to compare against</legend>
        <p className="w-full text-base text-ink-950">Equivalent coats at another let-down (clear : toner):</p>
        <TextField label="Clear parts" inputMode="decimal" defaultValue={toClear ?? ""} onChange={(e) => set("toClear", e.target.value)} fieldClassName="w-32" />
        <TextField label="Toner parts" inputMode="decimal" defaultValue={toToner ?? ""} onChange={(e) => set("toToner", e.target.value)} fieldClassName="w-32" />
        {ladder.data ? (
          <p className="pb-3 text-sm text-primer-800">
            Reference {ladder.data.reference.clear}:{ladder.data.reference.toner} (toner {(ladder.data.reference.tonerFraction * 100).toFixed(2)} % of clear + toner)
          </p>
        ) : null}
      </fieldset>
      {ladder.isPending ? (
        <Spinner label="Loading the ladder…" />
      ) : ladder.error ? (
        <Alert tone={isApiError(ladder.error) && ladder.error.status === 404 ? "info" : "error"}>{ladder.error.message}</Alert>
      ) : (
        <ol className="grid grid-cols-[repeat(auto-fill,minmax(10rem,1fr))] gap-4" aria-label="Panels from the lightest to the deepest">
          {ladder.data.rungs.map((r) => (
            <li key={r.panel.id} className="flex flex-col gap-1.5 rounded-xl border border-primer-200 bg-white p-3 shadow-card">
              <PanelSwatch panel={r.panel} />
              <Link to={paths.panel(r.panel.id)} className="text-lg font-semibold text-ink-950 underline underline-offset-2">
                {r.panel.coats} coats at {r.panel.letDownClear}:{r.panel.letDownToner}
              </Link>
              <p className="text-sm text-ink-950">
                as deep as <strong className="tabular-nums">{formatNumber(r.equivalentCoats, 2)}</strong> coats at {ladder.data.reference.clear}:{ladder.data.reference.toner}
              </p>
              <p className="text-xs text-primer-800 tabular-nums">Depth (toner fraction × coats) {formatNumber(r.depth, 3)}</p>
              <p className="text-xs text-primer-800 tabular-nums">{formatLab(r.panel.lab)}</p>
              {r.deltaEFromPrevious != null ? <p className="text-xs font-semibold text-ink-950 tabular-nums">ΔE00 from the rung before: {r.deltaEFromPrevious.toFixed(2)}</p> : null}
            </li>
          ))}
        </ol>
      )}
      <p className="mt-6 max-w-prose text-sm text-primer-800">
        Equivalent coats assume the same wet film per coat and a transparent dye (Beer–Lambert): coats × toner fraction stays the same. Flake and pearl layers, or a clear
        activated or reduced after the toner goes in, change the picture; spray a panel to confirm.
      </p>
    </>
  );
}
