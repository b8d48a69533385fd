import type { MixResult } from "@shared/mix/index";
import { RoundingNote } from "@/components/ui/rounding-note";
import { cn } from "@/utils/cn";
import { formatAmount, formatNumber } from "@/utils/format-quantity";

/**
 * A computed mix as a table: each component's amount, its share, grams and the running scale reading
 * (when every component has a density), and the amounts rounded for the cup or scale with the ratio error.
 */
export function MixPreview({ result, labels, caption }: { result: MixResult; labels?: Record<string, string>; caption?: string }) {
  const rounded = result.rounded;
  const scale = result.scale;
  return (
    <div className="flex flex-col gap-3">
      <div className="scrollbar-thin overflow-x-auto rounded-lg border border-primer-200 bg-white">
        <table className="w-full min-w-[30rem] text-left text-sm" aria-label={caption ?? "Mix amounts"}>
          <thead className="bg-primer-100">
            <tr>
              <th scope="col" className="px-3 py-2 font-semibold">Component</th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">Amount</th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">Share</th>
              {result.lines.some((l) => l.grams !== undefined) ? <th scope="col" className="px-3 py-2 text-right font-semibold">Grams</th> : null}
              {scale ? <th scope="col" className="px-3 py-2 text-right font-semibold">Scale reads</th> : null}
              {rounded ? <th scope="col" className="px-3 py-2 text-right font-semibold">Measure</th> : null}
            </tr>
          </thead>
          <tbody>
            {result.lines.map((l, i) => (
              <tr key={l.name} className="border-t border-primer-100">
                <th scope="row" className="px-3 py-2 font-semibold">
                  {l.name}
                  {labels?.[l.name] ? <span className="block text-xs font-normal text-primer-700">{labels[l.name]}</span> : null}
                </th>
                <td className="px-3 py-2 text-right text-base font-semibold tabular-nums">{formatAmount(l.volume, l.unit)}</td>
                <td className="px-3 py-2 text-right whitespace-nowrap tabular-nums">{formatNumber(l.share * 100, 1)} %</td>
                {result.lines.some((x) => x.grams !== undefined) ? <td className="px-3 py-2 text-right tabular-nums">{l.grams === undefined ? "—" : `${formatNumber(l.grams, 1)} g`}</td> : null}
                {scale ? <td className="px-3 py-2 text-right tabular-nums">{formatAmount(scale.steps[i]!.scaleReads, scale.unit, 4)}</td> : null}
                {rounded ? (
                  <td className={cn("px-3 py-2 text-right font-semibold tabular-nums", rounded.moved.includes(l.name) && "text-flake-800")}>
                    {formatAmount(rounded.lines[i]!.rounded, rounded.unit, 4)}
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
          <tfoot>
            <tr className="border-t border-primer-200 bg-primer-50 font-semibold">
              <th scope="row" className="px-3 py-2">Total</th>
              <td className="px-3 py-2 text-right tabular-nums">{formatAmount(result.total, result.unit)}</td>
              <td />
              {result.lines.some((l) => l.grams !== undefined) ? <td /> : null}
              {scale ? <td /> : null}
              {rounded ? <td className="px-3 py-2 text-right tabular-nums">{formatAmount(rounded.roundedTotal, rounded.unit, 4)}</td> : null}
            </tr>
          </tfoot>
        </table>
      </div>
      {rounded ? (
        <RoundingNote {...rounded} names={labels} />
      ) : null}
    </div>
  );
}
