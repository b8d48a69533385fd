import { useState } from "react";
import { Link } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { Flame, Package, ShieldAlert, TriangleAlert } from "lucide-react";
import { MATERIAL_CATEGORIES, MATERIAL_CATEGORY_LABELS, type MaterialCategory } from "@shared/domain/materials";
import { formatCents } from "@shared/quote/money";
import type { MaterialDto } from "@shared/schemas/material.schema";
import { paths } from "@/config/paths";
import { Alert } from "@/components/ui/alert";
import { EmptyState } from "@/components/ui/empty-state";
import { Panel } from "@/components/ui/panel";
import { SearchInput } from "@/components/ui/search-input";
import { SelectField } from "@/components/ui/form/select-field";
import { Spinner } from "@/components/ui/spinner";
import { formatAmount, formatNumber, unitSymbol } from "@/utils/format-quantity";
import { materialQueries } from "../api/materials.queries";

export function HazardIcons({ material }: { material: Pick<MaterialDto, "containsIsocyanates" | "flammable"> }) {
  return (
    <span className="inline-flex gap-1.5">
      {material.containsIsocyanates ? (
        <span title="Contains isocyanates" className="inline-flex items-center gap-1 rounded-full bg-flake-100 px-2 py-0.5 text-xs font-semibold text-flake-900">
          <ShieldAlert aria-hidden className="size-3.5" />
          Isocyanates
        </span>
      ) : null}
      {material.flammable ? (
        <span title="Flammable solvent" className="inline-flex items-center gap-1 rounded-full bg-red-50 px-2 py-0.5 text-xs font-semibold text-red-800">
          <Flame aria-hidden className="size-3.5" />
          Flammable
        </span>
      ) : null}
    </span>
  );
}

/** Materials at or below their low-stock level. */
export function LowStockPanel() {
  const { data, isPending } = useQuery(materialQueries.lowStock());
  if (isPending || !data || data.length === 0) return null;
  return (
    <Panel title="Low stock" titleId="low-stock-heading" className="mb-6 border-flake-400" actions={<TriangleAlert aria-hidden className="size-5 text-flake-700" />}>
      <ul className="grid gap-2 sm:grid-cols-2 xl:grid-cols-3" aria-labelledby="low-stock-heading">
        {data.map((m) => (
          <li key={m.id}>
            <Link to={paths.material(m.id)} className="flex min-h-12 items-center justify-between gap-3 rounded-lg border border-primer-200 px-3 py-2 hover:bg-primer-50">
              <span className="min-w-0">
                <span className="block truncate font-semibold text-ink-950">{m.name}</span>
                <span className="text-sm text-primer-700 tabular-nums">{m.code}</span>
              </span>
              <span className="text-right text-sm whitespace-nowrap tabular-nums">
                <span className="block font-semibold text-red-800">{formatAmount(m.stockOnHand, m.purchaseUnit)}</span>
                <span className="text-primer-700">level {formatAmount(m.lowStockThreshold ?? 0, m.purchaseUnit)}</span>
              </span>
            </Link>
          </li>
        ))}
      </ul>
    </Panel>
  );
}

/** The catalogue: filter by category, search by code or name; the office also sees the unit cost. */
export function MaterialsCatalogue({ showCost }: { showCost: boolean }) {
  const [category, setCategory] = useState<MaterialCategory | "">("");
  const [q, setQ] = useState("");
  const [includeInactive, setIncludeInactive] = useState(false);
  const { data, isPending, error } = useQuery(materialQueries.list({ category: category || undefined, q: q || undefined, includeInactive: includeInactive || undefined }));

  return (
    <div className="flex flex-col gap-4">
      <div className="grid gap-4 sm:grid-cols-[14rem_minmax(0,1fr)_auto] sm:items-end">
        <SelectField label="Category" value={category} onChange={(e) => setCategory(e.target.value as MaterialCategory | "")}>
          <option value="">All categories</option>
          {MATERIAL_CATEGORIES.map((c) => (
            <option key={c} value={c}>
              {MATERIAL_CATEGORY_LABELS[c]}
            </option>
          ))}
        </SelectField>
        <SearchInput label="Search materials" value={q} onSearch={setQ} placeholder="Code or name" />
        <label className="flex min-h-11 cursor-pointer items-center gap-2 text-sm font-semibold">
          <input type="checkbox" className="size-5 accent-candy-600" checked={includeInactive} onChange={(e) => setIncludeInactive(e.target.checked)} />
          Show retired
        </label>
      </div>
      {error ? <Alert tone="error">{error.message}</Alert> : null}
      {isPending ? (
        <Spinner label="Loading materials…" />
      ) : !data || data.length === 0 ? (
        <EmptyState icon={<Package aria-hidden />} title="No materials match">
          {q || category ? "Try another category or search." : "The catalogue is empty."}
        </EmptyState>
      ) : (
        <div className="scrollbar-thin overflow-x-auto rounded-xl border border-primer-200 bg-white shadow-card">
          <table aria-label="Materials" className="w-full min-w-[48rem] text-left text-sm">
            <thead className="bg-primer-100">
              <tr>
                <th scope="col" className="px-3 py-2 font-semibold">Code</th>
                <th scope="col" className="px-3 py-2 font-semibold">Name</th>
                <th scope="col" className="px-3 py-2 font-semibold">Category</th>
                <th scope="col" className="px-3 py-2 text-right font-semibold">On hand</th>
                <th scope="col" className="px-3 py-2 text-right font-semibold">Solids</th>
                <th scope="col" className="px-3 py-2 text-right font-semibold">VOC g/L</th>
                {showCost ? <th scope="col" className="px-3 py-2 text-right font-semibold">Cost</th> : null}
                <th scope="col" className="px-3 py-2 font-semibold">Hazards</th>
              </tr>
            </thead>
            <tbody>
              {data.map((m) => (
                <tr key={m.id} className="border-t border-primer-100 hover:bg-primer-50">
                  <td className="px-3 py-2.5 font-mono text-xs whitespace-nowrap">{m.code}</td>
                  <th scope="row" className="px-3 py-2.5 font-semibold">
                    <Link to={paths.material(m.id)} className="text-ink-900 underline-offset-2 hover:underline">
                      {m.name}
                    </Link>
                    {!m.active ? <span className="ml-2 rounded bg-primer-200 px-1.5 py-0.5 text-xs font-medium">Retired</span> : null}
                  </th>
                  <td className="px-3 py-2.5 whitespace-nowrap">{MATERIAL_CATEGORY_LABELS[m.category]}</td>
                  <td className="px-3 py-2.5 text-right whitespace-nowrap tabular-nums">
                    <span className={m.lowStock ? "font-semibold text-red-800" : undefined}>{formatAmount(m.stockOnHand, m.purchaseUnit)}</span>
                    {m.lowStock ? <span className="sr-only"> (low stock)</span> : null}
                  </td>
                  <td className="px-3 py-2.5 text-right whitespace-nowrap tabular-nums">{m.volumeSolidsPct == null ? "—" : `${formatNumber(m.volumeSolidsPct, 1)} %`}</td>
                  <td className="px-3 py-2.5 text-right tabular-nums">{m.vocGPerL == null ? "—" : formatNumber(m.vocGPerL, 0)}</td>
                  {showCost ? (
                    <td className="px-3 py-2.5 text-right whitespace-nowrap tabular-nums">
                      {m.costCents == null ? "—" : `${formatCents(m.costCents)} / ${unitSymbol(m.purchaseUnit)}`}
                    </td>
                  ) : null}
                  <td className="px-3 py-2.5">
                    <HazardIcons material={m} />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}
