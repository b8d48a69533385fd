import { useQuery } from "@tanstack/react-query";
import { Link, useSearchParams } from "react-router";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { Spinner } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { panelQueries } from "@/features/panels/api/panels.queries";
import { formatLab, PanelSwatch } from "@/features/panels/components/panel-swatch";
import { VerdictBadge } from "@/features/panels/components/verdict-badge";
import { formatDate } from "@/utils/format-date";
import { formatNumber } from "@/utils/format-quantity";
import { equivalentCoats } from "@shared/mix/index";
import { PANEL_LIGHT_LABELS, PANEL_LIGHTS } from "@shared/domain/spray-setup";

/** Panels side by side from the lightest to the deepest, with ΔE00 between each pair that has readings. */
export default function PanelsCompareRoute() {
  const [params] = useSearchParams();
  const ids = (params.get("ids") ?? "").split(",").map(Number).filter((n) => Number.isInteger(n) && n > 0);
  const compare = useQuery({ ...panelQueries.compare(ids), enabled: ids.length >= 2 });
  if (ids.length < 2) return <Alert tone="info">Pick at least two panels in the library to compare.</Alert>;
  if (compare.error) return <Alert tone="error">{compare.error.message}</Alert>;
  if (!compare.data) return <Spinner label="Loading panels…" />;
  const { pairs, thresholds } = compare.data;
  // Lightest first: colour depth follows toner fraction × coats, not the coat count across let-downs.
  const panels = [...compare.data.panels].sort((a, b) => a.tonerFraction * a.coats - b.tonerFraction * b.coats || a.id - b.id);
  const ref = { clear: panels[0]!.letDownClear, toner: panels[0]!.letDownToner };
  const rows: [string, (p: (typeof panels)[number]) => string][] = [
    ["Ground", (p) => p.groundName],
    ["Candy", (p) => p.candyName],
    ["Let-down", (p) => `${p.letDownClear}:${p.letDownToner} (toner ${(p.tonerFraction * 100).toFixed(1)} % of clear + toner)`],
    ["Coats", (p) => String(p.coats)],
    ["Depth (toner fraction × coats)", (p) => formatNumber(p.tonerFraction * p.coats, 3)],
    [`As deep as, at ${ref.clear}:${ref.toner}`, (p) => `${formatNumber(equivalentCoats(p.coats, { clear: p.letDownClear, toner: p.letDownToner }, ref), 2)} coats`],
    ["Reading, daylight (D65)", (p) => formatLab(p.lab)],
    ...PANEL_LIGHTS.filter((l) => l !== "daylight" && panels.some((p) => p.readings.some((r) => r.light === l))).map(
      (l): [string, (p: (typeof panels)[number]) => string] => [
        `Reading, ${PANEL_LIGHT_LABELS[l].toLowerCase()}`,
        (p) => {
          const r = p.readings.find((x) => x.light === l);
          return r ? `${formatLab(r.lab)} (${r.illuminant})` : "—";
        },
      ],
    ),
    ["Spray set-up", (p) => p.setup.summary || "—"],
    ["Sprayed", (p) => (p.sprayedOn ? formatDate(p.sprayedOn) : "—")],
    ["Job", (p) => p.jobTitle ?? "—"],
  ];
  return (
    <>
      <PageHeader title="Compare panels" description={`ΔE00 against the shop's colour tolerance: under ${thresholds.deltaEMatch} is within tolerance, under ${thresholds.deltaEClose} borderline, further out of tolerance.`} />
      <div className="overflow-x-auto pb-2">
        <table className="w-full min-w-[40rem] border-separate border-spacing-x-3 text-left">
          <caption className="sr-only">The compared panels, one per column</caption>
          <thead>
            <tr>
              <td />
              {panels.map((p) => (
                <th key={p.id} scope="col" className="w-56 align-top">
                  <PanelSwatch panel={p} className="max-w-56" />
                  <Link to={paths.panel(p.id)} className="mt-2 block text-base font-semibold text-ink-950 underline underline-offset-2">
                    {p.label}
                  </Link>
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map(([label, value]) => (
              <tr key={label}>
                <th scope="row" className="py-2 text-sm font-semibold whitespace-nowrap text-primer-800">
                  {label}
                </th>
                {panels.map((p) => (
                  <td key={p.id} className="border-b border-primer-200 py-2 text-base text-ink-950 tabular-nums">
                    {value(p)}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <Panel title="Colour difference (CIEDE2000)" titleId="pairs-heading" className="mt-6">
        {pairs.length === 0 ? (
          <p className="text-primer-800">None of these pairs both have meter readings.</p>
        ) : (
          <ul className="flex flex-col gap-2">
            {pairs.map((pair) => {
              const a = panels.find((p) => p.id === pair.a)!;
              const b = panels.find((p) => p.id === pair.b)!;
              return (
                <li key={`${pair.a}-${pair.b}`} className="flex flex-wrap items-center gap-3">
                  <VerdictBadge verdict={pair.verdict} deltaE={pair.deltaE} />
                  <span className="text-base">
                    {a.label} <span className="text-primer-700">vs</span> {b.label}
                  </span>
                </li>
              );
            })}
          </ul>
        )}
      </Panel>
    </>
  );
}
