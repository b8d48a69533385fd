import { useMemo } from "react";
import { useFieldArray, useForm, useWatch } from "react-hook-form";
import { Plus, Trash2 } from "lucide-react";
import { computeMix, MASS_UNITS, MixError, VOLUME_UNITS, type MeasuringUnit, type MixComponent, type MixResult, type VolumeUnit } from "@shared/mix/index";
import { MAX_MIX_COMPONENTS } from "@shared/schemas/mix.schema";
import { useQuery } from "@tanstack/react-query";
import { shopSettingsQueries } from "@/lib/shop-settings.queries";
import { RoundingNote } from "@/components/ui/rounding-note";
import { Button } from "@/components/ui/button";
import { SingleChoice } from "@/components/ui/choice-group";
import { SelectField } from "@/components/ui/form/select-field";
import { TextField } from "@/components/ui/form/text-field";
import { Panel } from "@/components/ui/panel";
import { cn } from "@/utils/cn";
import { formatAmount, formatNumber } from "@/utils/format-quantity";

/*
 * The Mix calculator: a mix written the painter's way (parts like 4:1:1, or a percent of other components),
 * how much to make (a wanted total, or the amount of one component on hand), units, optional densities for a
 * scale, and a rounding step. Everything is worked out in the browser with the shared mix engine (computeMix,
 * the same function behind POST /api/mix/compute) as the painter types.
 */

type Row = { name: string; kind: "parts" | "percent"; parts: string; percent: string; percentOf: string[]; density: string };
type Values = { rows: Row[]; mode: "total" | "component"; amount: string; unit: VolumeUnit; knownName: string; step: string; stepUnit: MeasuringUnit };

const num = (v: string) => (v.trim() === "" ? undefined : Number(v));

const START: Values = {
  rows: [
    { name: "clear", kind: "parts", parts: "4", percent: "", percentOf: [], density: "" },
    { name: "hardener", kind: "parts", parts: "1", percent: "", percentOf: [], density: "" },
    { name: "reducer", kind: "parts", parts: "1", percent: "", percentOf: [], density: "" },
  ],
  mode: "total",
  amount: "600",
  unit: "mL",
  knownName: "clear",
  step: "",
  stepUnit: "mL",
};

type Outcome = { result: MixResult | null; error: { row: number | null; field: string; message: string } | null };

function compute(v: Values, tolerancePct?: number): Outcome {
  const rows = v.rows ?? [];
  const components: MixComponent[] = rows.map((r) => {
    const density = num(r.density);
    const base = { name: r.name.trim(), ...(density !== undefined ? { densityGPerMl: density } : {}) };
    return r.kind === "percent" ? { ...base, percent: num(r.percent) as number, percentOf: r.percentOf ?? [] } : { ...base, parts: num(r.parts) as number };
  });
  const amount = num(v.amount ?? "");
  if (amount === undefined) return { result: null, error: { row: null, field: "amount", message: "Enter an amount" } };
  const step = num(v.step ?? "");
  try {
    const result = computeMix({
      components,
      mode: v.mode,
      amount,
      unit: v.unit,
      knownName: v.mode === "component" ? v.knownName : undefined,
      rounding: step !== undefined ? { step, unit: v.stepUnit, tolerancePct } : undefined,
    });
    return { result, error: null };
  } catch (e) {
    if (!(e instanceof MixError)) throw e;
    const row = e.component === undefined ? null : rows.findIndex((r) => r.name.trim() === e.component);
    return { result: null, error: { row: row !== null && row >= 0 ? row : null, field: e.field ?? "components", message: e.message } };
  }
}

export function MixCalculator() {
  const { control, register, setValue } = useForm<Values>({ defaultValues: START });
  const rows = useFieldArray({ control, name: "rows" });
  const v = useWatch({ control }) as Values;
  const tolerancePct = useQuery(shopSettingsQueries.public()).data?.ratioTolerancePct;
  const { result, error } = useMemo(() => compute(v, tolerancePct), [v, tolerancePct]);
  const names = (v.rows ?? []).map((r) => r.name.trim()).filter(Boolean);
  const rowError = (i: number, field: string) => (error && error.row === i && (error.field === field || (field === "name" && !["parts", "percent", "percentOf", "densityGPerMl"].includes(error.field))) ? error.message : undefined);
  const topError = (field: string) => (error && error.row === null && (error.field === field || (field === "amount" && error.field === "total")) ? error.message : undefined);
  const otherError = error && error.row === null && !["amount", "total", "knownName", "step", "unit"].includes(error.field) ? error.message : null;

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(0,1.1fr)_minmax(0,1fr)]">
      <Panel title="The mix" titleId="mix-heading">
        <form onSubmit={(e) => e.preventDefault()} noValidate className="flex flex-col gap-5">
          <ul className="flex flex-col gap-3" aria-labelledby="mix-heading">
            {rows.fields.map((f, i) => {
              const row = v.rows?.[i];
              const others = names.filter((n) => n !== row?.name.trim());
              return (
                <li key={f.id} className="flex flex-col gap-3 rounded-lg border border-primer-200 p-3">
                  <div className="flex items-start gap-2">
                    <TextField label={`Component ${i + 1}`} fieldClassName="min-w-0 flex-1" autoComplete="off" error={rowError(i, "name")} {...register(`rows.${i}.name`)} />
                    <TextField label="Density g/mL" fieldClassName="w-32" inputMode="decimal" placeholder="optional" error={rowError(i, "densityGPerMl")} {...register(`rows.${i}.density`)} />
                    <Button variant="ghost" size="sm" className="mt-7" disabled={rows.fields.length <= 1} onClick={() => rows.remove(i)} aria-label={`Remove component ${i + 1}`} icon={<Trash2 aria-hidden className="size-4" />} />
                  </div>
                  <div className="grid gap-3 sm:grid-cols-[auto_minmax(0,1fr)] sm:items-start">
                    <fieldset>
                      <legend className="mb-1.5 text-sm font-semibold">Given as</legend>
                      <div className="flex gap-1">
                        {(["parts", "percent"] as const).map((k) => (
                          <label key={k} className={cn("inline-flex min-h-11 cursor-pointer items-center rounded-lg border px-3 text-sm font-semibold", row?.kind === k ? "border-ink-900 bg-ink-900 text-white" : "border-primer-300 bg-white")}>
                            <input type="radio" value={k} className="sr-only" {...register(`rows.${i}.kind`)} />
                            {k === "parts" ? "Parts" : "Percent"}
                          </label>
                        ))}
                      </div>
                    </fieldset>
                    {row?.kind === "percent" ? (
                      <div className="grid gap-2 sm:grid-cols-[7rem_minmax(0,1fr)]">
                        <TextField label="Percent" inputMode="decimal" error={rowError(i, "percent")} {...register(`rows.${i}.percent`)} />
                        <fieldset>
                          <legend className="mb-1 text-sm font-semibold">of</legend>
                          <div className="flex flex-wrap gap-x-3">
                            {others.map((o) => (
                              <label key={o} className="inline-flex min-h-10 items-center gap-2 text-sm">
                                <input
                                  type="checkbox"
                                  className="size-5 accent-candy-600"
                                  checked={(row?.percentOf ?? []).includes(o)}
                                  onChange={(ev) => {
                                    const now = (row?.percentOf ?? []).filter((x) => x !== o && others.includes(x));
                                    setValue(`rows.${i}.percentOf`, ev.target.checked ? [...now, o] : now);
                                  }}
                                />
                                {o}
                              </label>
                            ))}
                          </div>
                          {rowError(i, "percentOf") ? <p className="text-sm font-medium text-red-800">{rowError(i, "percentOf")}</p> : null}
                        </fieldset>
                      </div>
                    ) : (
                      <TextField label="Parts" fieldClassName="max-w-40" inputMode="decimal" error={rowError(i, "parts")} {...register(`rows.${i}.parts`)} />
                    )}
                  </div>
                </li>
              );
            })}
          </ul>
          <div>
            <Button
              variant="secondary"
              disabled={rows.fields.length >= MAX_MIX_COMPONENTS}
              onClick={() => rows.append({ name: `part ${rows.fields.length + 1}`, kind: "parts", parts: "1", percent: "", percentOf: [], density: "" })}
              icon={<Plus aria-hidden className="size-4" />}
            >
              Add component
            </Button>
          </div>
          {otherError ? <p className="text-sm font-medium text-red-800">{otherError}</p> : null}
          <SingleChoice
            label="How much"
            value={v.mode ?? "total"}
            onChange={(mode) => setValue("mode", mode)}
            options={[
              { value: "total", label: "Make a set amount" },
              { value: "component", label: "Scale to what is on hand" },
            ]}
          />
          <div className="grid gap-4 sm:grid-cols-3">
            {v.mode === "component" ? (
              <SelectField label="Which component" error={topError("knownName")} {...register("knownName")}>
                {names.map((n) => (
                  <option key={n} value={n}>
                    {n}
                  </option>
                ))}
              </SelectField>
            ) : null}
            <TextField label={v.mode === "component" ? "Amount on hand" : "Wanted total"} inputMode="decimal" autoComplete="off" error={topError("amount")} {...register("amount")} />
            <SelectField label="Unit" error={topError("unit")} {...register("unit")}>
              {VOLUME_UNITS.map((u) => (
                <option key={u.value} value={u.value}>
                  {u.label}
                </option>
              ))}
            </SelectField>
          </div>
          <div className="grid gap-4 sm:grid-cols-3">
            <TextField label="Round to a step of" inputMode="decimal" placeholder="exact" hint="What your cup or scale shows" error={topError("step")} {...register("step")} />
            <SelectField label="Step unit" {...register("stepUnit")}>
              {[...VOLUME_UNITS, ...MASS_UNITS].map((u) => (
                <option key={u.value} value={u.value}>
                  {u.label}
                </option>
              ))}
            </SelectField>
          </div>
        </form>
      </Panel>
      <Panel title="Amounts" titleId="amounts-heading" className="self-start">
        <div aria-live="polite">
          {result ? <Results result={result} /> : <p className="text-primer-700">{error ? "Fix the highlighted field to see the amounts." : "Enter an amount."}</p>}
        </div>
        <p className="mt-4 text-xs text-primer-700">Volumes are assumed to add. The maker&apos;s technical data sheet governs the ratio and the reduction.</p>
      </Panel>
    </div>
  );
}

function Results({ result }: { result: MixResult }) {
  const grams = result.lines.some((l) => l.grams !== undefined);
  const r = result.rounded;
  return (
    <div className="flex flex-col gap-3">
      <table className="w-full text-left text-sm" aria-label="Amounts to measure">
        <thead className="bg-primer-100">
          <tr>
            <th scope="col" className="px-3 py-2 font-semibold">Component</th>
            <th scope="col" className="px-3 py-2 text-right font-semibold">Amount</th>
            {grams ? <th scope="col" className="px-3 py-2 text-right font-semibold">Grams</th> : null}
            {result.scale ? <th scope="col" className="px-3 py-2 text-right font-semibold">Scale reads</th> : null}
            {r ? <th scope="col" className="px-3 py-2 text-right font-semibold">Measure</th> : null}
          </tr>
        </thead>
        <tbody>
          {result.lines.map((l, i) => (
            <tr key={l.name} className="border-t border-primer-100">
              <th scope="row" className="px-3 py-2 font-semibold">
                {l.name}
                <span className="block text-xs font-normal text-primer-700">{formatNumber(l.share * 100, 1)} %</span>
              </th>
              <td className="px-3 py-2 text-right text-lg font-bold tabular-nums" data-testid={`amount-${l.name}`}>
                {formatAmount(l.volume, l.unit)}
              </td>
              {grams ? <td className="px-3 py-2 text-right tabular-nums">{l.grams === undefined ? "—" : `${formatNumber(l.grams, 1)} g`}</td> : null}
              {result.scale ? <td className="px-3 py-2 text-right font-semibold tabular-nums">{formatAmount(result.scale.steps[i]!.scaleReads, result.scale.unit, 4)}</td> : null}
              {r ? (
                <td className={cn("px-3 py-2 text-right font-semibold tabular-nums", r.moved.includes(l.name) && "text-flake-800")}>{formatAmount(r.lines[i]!.rounded, r.unit, 4)}</td>
              ) : null}
            </tr>
          ))}
        </tbody>
        <tfoot>
          <tr className="border-t border-primer-200 bg-primer-50 font-semibold">
            <th scope="row" className="px-3 py-2">Total</th>
            <td className="px-3 py-2 text-right tabular-nums">{formatAmount(result.total, result.unit)}</td>
            {grams ? <td /> : null}
            {result.scale ? <td /> : null}
            {r ? <td className="px-3 py-2 text-right tabular-nums">{formatAmount(r.roundedTotal, r.unit, 4)}</td> : null}
          </tr>
        </tfoot>
      </table>
      {r ? (
        <RoundingNote {...r} />
      ) : null}
    </div>
  );
}
