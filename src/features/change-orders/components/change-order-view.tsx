import { CHANGE_ORDER_KIND_LABELS, CHANGE_ORDER_STATUS_LABELS, type LayerFace } from "@shared/domain/change-orders";
import { QUOTE_LINE_KIND_LABELS, customerLineDetail, formatCents } from "@shared/quote/index";
import type { ChangeOrderDto } from "@shared/schemas/change-order.schema";
import { cn } from "@/utils/cn";

const face = (f: LayerFace | null) =>
  f ? (
    <>
      <span className="font-semibold text-ink-950">{f.name}</span>
      <span className="block text-xs text-primer-700">
        {f.coats} {f.coats === 1 ? "coat" : "coats"}
        {f.mix ? ` · ${f.mix}` : ""}
      </span>
    </>
  ) : (
    <span className="text-primer-700">(none)</span>
  );

/** The two layer stacks side by side, the changed rows marked. */
export function ChangeOrderLayers({ co }: { co: ChangeOrderDto }) {
  if (!co.layers.length) return null;
  return (
    <table className="w-full text-left text-sm">
      <caption className="sr-only">Layers before and after change order #{co.id}</caption>
      <thead>
        <tr className="text-xs tracking-wide text-primer-700 uppercase">
          <th scope="col" className="py-1 pr-3">
            Version {co.fromVersion?.version} (approved)
          </th>
          <th scope="col" className="py-1 pr-3">
            Version {co.toVersion?.version} (the change)
          </th>
          <th scope="col" className="py-1">
            <span className="sr-only">Changed</span>
          </th>
        </tr>
      </thead>
      <tbody>
        {co.layers.map((p, i) => (
          <tr key={i} className={cn("border-t border-primer-200 align-top", p.changed && "bg-amber-50")}>
            <td className="py-2 pr-3">{face(p.before)}</td>
            <td className="py-2 pr-3">{face(p.after)}</td>
            <td className="py-2 text-xs font-semibold text-amber-900">{p.changed ? "Changed" : ""}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** The price difference as lines and totals (for those who see money). */
export function ChangeOrderMoney({ co }: { co: ChangeOrderDto }) {
  const m = co.money;
  if (!m) return null;
  return (
    <dl className="grid grid-cols-[1fr_auto] gap-x-4 gap-y-1 text-sm tabular-nums">
      {m.lines.map((l, i) => (
        <div key={i} className="contents">
          <dt className="text-primer-800">
            {QUOTE_LINE_KIND_LABELS[l.kind]}: {l.description}
            {customerLineDetail(l) ? <span className="block text-xs text-primer-700">{customerLineDetail(l)}</span> : null}
          </dt>
          <dd className="text-right text-ink-950">{formatCents(m.lineCents[i] ?? 0)}</dd>
        </div>
      ))}
      {m.taxCents ? (
        <>
          <dt className="text-primer-800">Tax ({m.taxPercent} %)</dt>
          <dd className="text-right">{formatCents(m.taxCents)}</dd>
        </>
      ) : null}
      <dt className="font-semibold text-ink-950">Price difference</dt>
      <dd className="text-right font-semibold text-ink-950">{formatCents(m.totalCents)}</dd>
      {m.depositCents > 0 ? (
        <>
          <dt className="text-primer-800">Extra deposit ({m.depositPercent} %)</dt>
          <dd className="text-right">
            {formatCents(m.depositCents)}
            {m.paidCents > 0 ? <span className="block text-xs text-emerald-900">{formatCents(m.paidCents)} paid</span> : null}
          </dd>
        </>
      ) : null}
    </dl>
  );
}

/** What changed in words, its kind and status, the colour flag. */
export function ChangeOrderHead({ co }: { co: ChangeOrderDto }) {
  return (
    <div className="flex flex-col gap-1">
      <p className="text-xs font-semibold tracking-wide text-primer-700 uppercase">
        Change order #{co.id} · {CHANGE_ORDER_KIND_LABELS[co.kind]} · <span data-testid="change-order-status">{CHANGE_ORDER_STATUS_LABELS[co.status]}</span>
      </p>
      <p className="text-ink-950">{co.summary}</p>
      {co.colourChanged ? <p className="text-sm font-semibold text-amber-900">The colour changes: a new test panel needs the customer's approval.</p> : null}
    </div>
  );
}
