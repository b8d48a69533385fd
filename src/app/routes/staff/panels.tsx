import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { useSearchParams } from "react-router";
import { GitCompareArrows, Layers3, Plus } from "lucide-react";
import { Alert } from "@/components/ui/alert";
import { ButtonLink } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { SelectField } from "@/components/ui/form/select-field";
import { TextField } from "@/components/ui/form/text-field";
import { Spinner } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { panelQueries } from "@/features/panels/api/panels.queries";
import { PanelCard } from "@/features/panels/components/panel-card";
import { MAX_COMPARE } from "@shared/schemas/panel.schema";

/** The test-panel library: filter by ground, candy and coats; pick panels to compare side by side. */
export default function PanelsRoute() {
  const [params, setParams] = useSearchParams();
  const ground = params.get("ground") ?? "";
  const candy = params.get("candy") ?? "";
  const coats = Number(params.get("coats")) || undefined;
  const q = params.get("q") ?? "";
  const list = useQuery(panelQueries.list({ ground: ground || undefined, candy: candy || undefined, coats, q: q || undefined, pageSize: 100 }));
  const [picked, setPicked] = useState<number[]>([]);
  const set = (key: string, value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(key, value);
    else next.delete(key);
    setParams(next, { replace: true });
  };
  const toggle = (id: number) => setPicked((p) => (p.includes(id) ? p.filter((x) => x !== id) : p.length >= MAX_COMPARE ? p : [...p, id]));
  const facets = list.data?.facets;

  return (
    <>
      <PageHeader
        title="Test panels"
        description="Sprayed panels and how each was made. A candy's colour depends on the ground under it and on how many coats went down."
        actions={
          <ButtonLink to={paths.newPanel()} icon={<Plus aria-hidden className="size-5" />}>
            New panel
          </ButtonLink>
        }
      />
      <form role="search" aria-label="Filter panels" className="mb-5 grid gap-3 rounded-xl border border-primer-200 bg-white p-4 shadow-card sm:grid-cols-2 lg:grid-cols-4" onSubmit={(e) => e.preventDefault()}>
        <SelectField label="Ground coat" value={ground} onChange={(e) => set("ground", e.target.value)}>
          <option value="">Any ground</option>
          {facets?.grounds.map((g) => (
            <option key={g} value={g}>
              {g}
            </option>
          ))}
        </SelectField>
        <SelectField label="Candy" value={candy} onChange={(e) => set("candy", e.target.value)}>
          <option value="">Any candy</option>
          {facets?.candies.map((c) => (
            <option key={c} value={c}>
              {c}
            </option>
          ))}
        </SelectField>
        <SelectField label="Coats" value={coats ? String(coats) : ""} onChange={(e) => set("coats", e.target.value)}>
          <option value="">Any number</option>
          {facets?.coats.map((c) => (
            <option key={c} value={c}>
              {c}
            </option>
          ))}
        </SelectField>
        <TextField label="Search" type="search" defaultValue={q} placeholder="Name or note" onChange={(e) => set("q", e.target.value)} />
      </form>
      <div className="mb-4 flex flex-wrap items-center gap-3" aria-live="polite">
        {picked.length ? <span className="text-base font-medium text-ink-950">{picked.length} picked to compare (up to {MAX_COMPARE})</span> : <span className="text-sm text-primer-800">Tap “Compare” on two or more panels to see them side by side.</span>}
        {picked.length >= 2 ? (
          <ButtonLink to={paths.panelsCompare(picked)} size="lg" icon={<GitCompareArrows aria-hidden className="size-5" />}>
            Compare {picked.length} panels
          </ButtonLink>
        ) : null}
        {ground && candy ? (
          <ButtonLink to={paths.panelsLadder(ground, candy)} variant="secondary" size="lg" icon={<Layers3 aria-hidden className="size-5" />}>
            Depth ladder: {candy} over {ground}
          </ButtonLink>
        ) : (
          <span className="text-sm text-primer-800">Choose a ground and a candy for the depth ladder.</span>
        )}
      </div>
      {list.isPending ? (
        <Spinner label="Loading panels…" />
      ) : list.error ? (
        <Alert tone="error">{list.error.message}</Alert>
      ) : list.data.items.length === 0 ? (
        <EmptyState title="No panels match" />
      ) : (
        <>
          <p className="mb-2 text-sm text-primer-800">{list.data.total} panels</p>
          <ul className="grid grid-cols-[repeat(auto-fill,minmax(11rem,1fr))] gap-4">
            {list.data.items.map((p) => (
              <PanelCard key={p.id} panel={p} href={paths.panel(p.id)} selected={picked.includes(p.id)} onToggleCompare={() => toggle(p.id)} />
            ))}
          </ul>
        </>
      )}
    </>
  );
}
