import { useId, useState } from "react";
import { FilterX, SlidersHorizontal } from "lucide-react";
import { OPEN_STAGES, STAGE_LABELS, STAGES, type Stage } from "@shared/domain/stages";
import type { PainterDto } from "@shared/schemas/user.schema";
import { Button } from "@/components/ui/button";
import { MultiChoice, SingleChoice } from "@/components/ui/choice-group";
import { Select } from "@/components/ui/form/select";
import { SearchInput } from "@/components/ui/search-input";
import { cn } from "@/utils/cn";
import { stageParamFor, type DueFilter } from "../hooks/use-job-list-params";

const DUE_OPTIONS: { value: DueFilter; label: string }[] = [
  { value: "", label: "Any date" },
  { value: "overdue", label: "Overdue" },
  { value: "week", label: "Due this week" },
];

/** Search is always in view; on phones the other filters fold away behind a "Filters" button. */
export function JobsFilters({
  q,
  stages,
  due,
  painterId,
  painters,
  customerFiltered,
  filtered,
  onChange,
}: {
  q: string;
  stages: Stage[];
  due: DueFilter;
  painterId: string;
  /** Office roles can filter by painter; painters only ever see their own jobs. */
  painters?: PainterDto[];
  /** The list is narrowed to one customer (?customer=, from a customer's page). */
  customerFiltered: boolean;
  filtered: boolean;
  onChange: (patch: Record<string, string | readonly string[] | null>, options?: { replace?: boolean }) => void;
}) {
  const painterSelectId = useId();
  const panelId = useId();
  const [open, setOpen] = useState(false);
  return (
    <div className="mb-4 flex flex-col gap-4 rounded-xl border border-primer-200 bg-white p-4 shadow-card">
      <div className="flex flex-wrap items-end gap-3">
        <SearchInput
          label="Search jobs"
          value={q}
          onSearch={(text) => onChange({ q: text }, { replace: true })}
          placeholder="Title, customer or #number"
          className="min-w-[12rem] flex-1"
        />
        <Button
          variant="secondary"
          className="md:hidden"
          aria-expanded={open}
          aria-controls={panelId}
          onClick={() => setOpen((v) => !v)}
          icon={<SlidersHorizontal aria-hidden className="size-4" />}
        >
          Filters
        </Button>
        {painters ? (
          <div className={cn("min-w-[12rem] flex-col gap-1.5", open ? "flex" : "hidden md:flex")}>
            <label htmlFor={painterSelectId} className="text-sm font-semibold text-ink-950">
              Painter filter
            </label>
            <Select id={painterSelectId} value={painterId} onChange={(e) => onChange({ painter: e.target.value })}>
              <option value="">All painters</option>
              {painters.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.name}
                </option>
              ))}
            </Select>
          </div>
        ) : null}
      </div>
      <div id={panelId} className={cn("flex-col gap-4", open ? "flex" : "hidden md:flex")}>
        <SingleChoice label="Due" options={DUE_OPTIONS} value={due} onChange={(value) => onChange({ due: value || null })} />
        <MultiChoice
          label="Stage"
          options={STAGES.map((s) => ({ value: s, label: STAGE_LABELS[s] }))}
          value={stages}
          onChange={(value) => onChange({ stage: stageParamFor(value) })}
        />
      </div>
      <div className="flex flex-wrap gap-2 border-t border-primer-100 pt-3">
        <Button variant="ghost" size="sm" aria-pressed={stageParamFor(stages) === null} onClick={() => onChange({ stage: stageParamFor(OPEN_STAGES) })}>
          Open work only
        </Button>
        <Button variant="ghost" size="sm" aria-pressed={stages.length === 0} onClick={() => onChange({ stage: stageParamFor(STAGES) })}>
          Every stage
        </Button>
        {customerFiltered ? (
          <Button variant="ghost" size="sm" onClick={() => onChange({ customer: null })} icon={<FilterX aria-hidden className="size-4" />}>
            One customer only: show all
          </Button>
        ) : null}
        {filtered ? (
          <Button
            variant="ghost"
            size="sm"
            className="ml-auto"
            onClick={() => onChange({ q: null, stage: null, due: null, painter: null, customer: null })}
            icon={<FilterX aria-hidden className="size-4" />}
          >
            Reset filters
          </Button>
        ) : null}
      </div>
    </div>
  );
}
