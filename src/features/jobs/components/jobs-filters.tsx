import { useId } from "react";
import { FilterX } from "lucide-react";
import { STAGE_LABELS, STAGES, type Stage } from "@shared/domain/stages";
import type { PainterDto } from "@shared/schemas/user.schema";
import { Button } from "@/components/ui/button";
import { MultiChoice, SingleChoice } from "@/components/ui/choice-group";
import { controlClasses } from "@/components/ui/form/field";
import { SearchInput } from "@/components/ui/search-input";
import type { DueFilter } from "../hooks/use-job-list-params";

const DUE_OPTIONS: { value: DueFilter; label: string }[] = [
  { value: "", label: "Any date" },
  { value: "overdue", label: "Overdue" },
  { value: "week", label: "Due this week" },
];

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
  return (
    <div className="mb-4 flex flex-col gap-4 rounded-xl border border-primer-200 bg-white p-4 shadow-card">
      <div className="flex flex-wrap items-end gap-4">
        <SearchInput
          label="Search jobs"
          value={q}
          onSearch={(text) => onChange({ q: text }, { replace: true })}
          placeholder="Title, customer or #number"
          className="min-w-[16rem] flex-1"
        />
        {painters ? (
          <div className="flex min-w-[12rem] flex-col gap-1.5">
            <label htmlFor={painterSelectId} className="text-sm font-semibold text-ink-950">
              Painter filter
            </label>
            <select id={painterSelectId} value={painterId} onChange={(e) => onChange({ painter: e.target.value })} className={controlClasses}>
              <option value="">All painters</option>
              {painters.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.name}
                </option>
              ))}
            </select>
          </div>
        ) : null}
        {customerFiltered ? (
          <Button variant="secondary" onClick={() => onChange({ customer: null })} icon={<FilterX aria-hidden className="size-4" />}>
            Showing one customer: show all
          </Button>
        ) : null}
        {filtered ? (
          <Button variant="ghost" onClick={() => onChange({ q: null, stage: null, due: null, painter: null, customer: null })} icon={<FilterX aria-hidden className="size-4" />}>
            Clear filters
          </Button>
        ) : null}
      </div>
      <SingleChoice label="Due" options={DUE_OPTIONS} value={due} onChange={(value) => onChange({ due: value || null })} />
      <MultiChoice
        label="Stage"
        options={STAGES.map((s) => ({ value: s, label: STAGE_LABELS[s] }))}
        value={stages}
        onChange={(value) => onChange({ stage: STAGES.filter((s) => value.includes(s)) })}
      />
    </div>
  );
}
