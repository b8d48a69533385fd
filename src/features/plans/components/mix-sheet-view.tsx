import { useEffect, useState } from "react";
import { useForm, type Resolver } from "react-hook-form";
import { RoundingNote } from "@/components/ui/rounding-note";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { Check, Clock } from "lucide-react";
import { MASS_UNITS, VOLUME_UNITS, type MeasuringUnit } from "@shared/mix/index";
import { formatCents } from "@shared/quote/money";
import { recordMixSheetInputSchema, type MixSheetDto, type MixSheetLineDto, type RecordMixSheetInput } from "@shared/schemas/mix-sheet.schema";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { controlClasses } from "@/components/ui/form/field";
import { SelectField } from "@/components/ui/form/select-field";
import { SafetyCautions } from "@/components/ui/safety-cautions";
import { cn } from "@/utils/cn";
import { formatDateTime } from "@/utils/format-date";
import { formatAmount, formatNumber, formatVolume, unitSymbol } from "@/utils/format-quantity";

/** Rules for the printed sheet: only the sheet, on one page. */
export const MIX_SHEET_PRINT_CSS = `
@media print {
  @page { size: auto; margin: 10mm; }
  html, body { background: #fff !important; }
  body header, body nav, .print-hidden, [aria-live].fixed, a[href="#main"] { display: none !important; }
  div:has(> main#main) { display: block !important; background: #fff !important; min-height: 0 !important; }
  main#main { padding: 0 !important; width: 100% !important; }
  .mix-sheet { font-size: 10pt; gap: 6px !important; color: #000; }
  .mix-sheet h1 { font-size: 16pt !important; }
  .mix-sheet table { min-width: 0 !important; }
  .mix-sheet th, .mix-sheet td { padding: 2px 6px !important; }
  .mix-sheet [role="note"] { padding: 4px 8px !important; font-size: 8.5pt; }
  .print-only { display: block !important; }
  th.print-only, td.print-only { display: table-cell !important; }
  .mix-sheet section, .mix-sheet table { break-inside: avoid; box-shadow: none !important; }
}
.print-only { display: none; }
`;

function useNow(everyMs = 30_000) {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const t = window.setInterval(() => setNow(Date.now()), everyMs);
    return () => window.clearInterval(t);
  }, [everyMs]);
  return now;
}

function minutesText(ms: number) {
  const m = Math.round(Math.abs(ms) / 60_000);
  return m >= 60 ? `${Math.floor(m / 60)} h ${m % 60} min` : `${m} min`;
}

export function PotLife({ sheet }: { sheet: MixSheetDto }) {
  const now = useNow();
  if (!sheet.potLifeMinutes) return <p className="text-sm text-primer-700">No pot life: nothing in this batch is catalysed.</p>;
  if (!sheet.potLifeEndsAt) return <p className="text-base font-semibold">Pot life {sheet.potLifeMinutes} min from mixing</p>;
  const left = Date.parse(sheet.potLifeEndsAt) - now;
  const over = left <= 0;
  return (
    <p className={cn("flex items-center gap-2 text-base font-semibold", over ? "text-red-800" : "text-ink-950")} role="status">
      <Clock aria-hidden className="size-5" />
      Pot life ends {formatDateTime(sheet.potLifeEndsAt)}
      {sheet.status === "mixed" ? <span className="font-normal">({over ? `ended ${minutesText(left)} ago` : `${minutesText(left)} left`})</span> : null}
    </p>
  );
}

/** The batch table: amounts in the sheet's unit, grams and scale readings, rounded amounts, lots. */
export function MixSheetTable({ sheet }: { sheet: MixSheetDto }) {
  const showGrams = sheet.lines.some((l) => l.grams != null);
  const showScale = sheet.weigh && sheet.scaleUnit != null && sheet.lines.every((l) => l.scaleReads != null);
  const showRounded = sheet.roundingStep != null && sheet.lines.every((l) => l.rounded != null);
  const recorded = sheet.status !== "draft";
  const showCost = recorded && sheet.totalCostCents !== undefined;
  return (
    <div className="scrollbar-thin overflow-x-auto rounded-lg border border-primer-200 bg-white">
      <table className="w-full min-w-[40rem] text-left text-sm" aria-label="Components">
        <thead className="bg-primer-100">
          <tr>
            <th scope="col" className="px-3 py-2 font-semibold">Component</th>
            <th scope="col" className="px-3 py-2 text-right font-semibold">Amount</th>
            {showGrams ? <th scope="col" className="px-3 py-2 text-right font-semibold">Grams</th> : null}
            {showScale ? <th scope="col" className="px-3 py-2 text-right font-semibold">Scale reads</th> : null}
            {showRounded ? <th scope="col" className="px-3 py-2 text-right font-semibold">Measure</th> : null}
            <th scope="col" className="px-3 py-2 font-semibold">{recorded ? "Lot used" : "Lot to use"}</th>
            {recorded ? <th scope="col" className="px-3 py-2 text-right font-semibold">Poured</th> : null}
            {showCost ? <th scope="col" className="px-3 py-2 text-right font-semibold">Cost</th> : null}
            {!recorded ? <th scope="col" className="print-only px-3 py-2 font-semibold">Done</th> : null}
          </tr>
        </thead>
        <tbody>
          {sheet.lines.map((l) => (
            <tr key={l.id} className="border-t border-primer-100 align-top">
              <th scope="row" className="px-3 py-2">
                <span className="block text-base font-semibold">{l.label}</span>
                <span className="block text-xs font-normal text-primer-700">
                  <span className="font-mono">{l.materialCode}</span> {l.materialName}
                </span>
                <span className="block text-xs font-normal text-ink-900">
                  {l.asPlanned ? `${l.asPlanned} · ` : ""}
                  {formatNumber(l.share * 100, 1)} % of the ready-to-spray mix
                </span>
              </th>
              <td className="px-3 py-2 text-right text-base font-semibold whitespace-nowrap tabular-nums">{formatAmount(l.amount, sheet.unit)}</td>
              {showGrams ? <td className="px-3 py-2 text-right whitespace-nowrap tabular-nums">{l.grams == null ? "—" : `${formatNumber(l.grams, 1)} g`}</td> : null}
              {showScale ? <td className="px-3 py-2 text-right text-base font-semibold tabular-nums">{formatAmount(l.scaleReads!, sheet.scaleUnit!, 4)}</td> : null}
              {showRounded ? (
                <td className={cn("px-3 py-2 text-right text-base font-semibold tabular-nums", sheet.movedComponents.includes(l.label) && "text-flake-800")}>
                  {formatAmount(l.rounded!, sheet.roundingUnit ?? sheet.unit, 4)}
                </td>
              ) : null}
              <td className="px-3 py-2 font-mono text-sm">{recorded ? (l.lotNumber ?? "—") : (lotLabel(l) ?? "—")}</td>
              {recorded ? <td className="px-3 py-2 text-right tabular-nums">{l.actualMl == null ? "—" : formatVolume(l.actualMl, sheet.unit)}</td> : null}
              {showCost ? <td className="px-3 py-2 text-right tabular-nums">{l.costCents == null ? "—" : formatCents(l.costCents)}</td> : null}
              {!recorded ? <td className="print-only px-3 py-2">☐</td> : null}
            </tr>
          ))}
        </tbody>
        <tfoot>
          <tr className="border-t border-primer-200 bg-primer-50 font-semibold">
            <th scope="row" className="px-3 py-2">Total</th>
            <td className="px-3 py-2 text-right tabular-nums">{formatAmount(sheet.total, sheet.unit)}</td>
            {showGrams ? <td /> : null}
            {showScale ? <td className="px-3 py-2 text-right tabular-nums">{formatAmount(sheet.scaleLastReading!, sheet.scaleUnit!, 4)}</td> : null}
            {showRounded ? <td className="px-3 py-2 text-right tabular-nums">{formatAmount(sheet.roundedTotal ?? 0, sheet.roundingUnit ?? sheet.unit, 4)}</td> : null}
            <td />
            {recorded ? <td className="px-3 py-2 text-right tabular-nums">{formatVolume(sheet.totalMl, sheet.unit)}</td> : null}
            {showCost ? <td className="px-3 py-2 text-right tabular-nums">{formatCents(sheet.totalCostCents ?? 0)}</td> : null}
            {!recorded ? <td className="print-only" /> : null}
          </tr>
        </tfoot>
      </table>
    </div>
  );
}

function lotLabel(l: MixSheetLineDto) {
  const lot = l.lots.find((x) => x.id === l.suggestedLotId);
  return lot ? `${lot.lotNumber} (${formatAmount(lot.quantityOnHand, lot.purchaseUnit, 3)} left)` : null;
}

export function RatioWarning({ sheet }: { sheet: MixSheetDto }) {
  if (sheet.roundingStep == null || sheet.roundingUnit == null || sheet.roundedTotal == null) return null;
  return (
    <RoundingNote
      step={sheet.roundingStep}
      unit={sheet.roundingUnit}
      lines={sheet.lines.map((l) => ({ name: l.label, ratioErrorPct: l.ratioErrorPct ?? 0, reference: l.ratioReference ?? [] }))}
      moved={sheet.movedComponents}
      tolerancePct={sheet.ratioTolerancePct}
      names={Object.fromEntries(sheet.lines.map((l) => [l.label, `${l.label} (${l.materialCode} ${l.materialName})`]))}
    />
  );
}

type RecordForm = { actualUnit: string; lines: { lineId: number; lotId: string; actual: string }[] };
const recordSchemaResolver = zodResolver(recordMixSheetInputSchema) as unknown as Resolver<RecordMixSheetInput, unknown, z.output<typeof recordMixSheetInputSchema>>;
const toRecordInput = (v: RecordForm): RecordMixSheetInput => ({
  actualUnit: v.actualUnit as MeasuringUnit,
  lines: v.lines.map((l) => ({ lineId: l.lineId, lotId: l.lotId === "" ? null : Number(l.lotId), actual: l.actual })),
});
/** The shared schema on the converted values ("no lot" → null). */
const recordResolver: Resolver<RecordForm, unknown, z.output<typeof recordMixSheetInputSchema>> = (values, ctx, options) =>
  recordSchemaResolver(toRecordInput(values), ctx, options as never) as never;

/** Record the batch as mixed: the lot each component was poured from and what was really poured. */
export function RecordMixedForm({ sheet, onRecord }: { sheet: MixSheetDto; onRecord: (input: RecordMixSheetInput) => Promise<unknown> }) {
  const [problem, setProblem] = useState<string | null>(null);
  const defaultUnit = sheet.weigh ? "g" : sheet.unit;
  // Defaults: what the sheet says to measure — the rounded amounts when it was rounded in this unit, else the
  // exact ones (in grams when the batch is weighed).
  const planned = (l: MixSheetLineDto) => {
    if (l.rounded != null && sheet.roundingUnit === defaultUnit) return l.rounded;
    return sheet.weigh ? (l.grams ?? 0) : l.amount;
  };
  const {
    register,
    handleSubmit,
    setError,
    watch,
    formState: { errors, isSubmitting },
  } = useForm<RecordForm, unknown, z.output<typeof recordMixSheetInputSchema>>({
    resolver: recordResolver,
    defaultValues: {
      actualUnit: defaultUnit,
      lines: sheet.lines.map((l) => ({ lineId: l.id, lotId: l.suggestedLotId ? String(l.suggestedLotId) : "", actual: String(Number(planned(l).toFixed(2))) })),
    },
  });
  const unit = watch("actualUnit");
  const submit = handleSubmit(
    async () => {
      setProblem(null);
      try {
        await onRecord(toRecordInput(watch()));
      } catch (error) {
        if (isApiError(error)) {
          for (const [field, message] of Object.entries(error.fields)) setError(field as never, { type: "server", message });
          setProblem(error.message);
        } else setProblem("Something went wrong. Try again.");
      }
    },
    () => setProblem("Check the highlighted fields."),
  );
  const units = sheet.lines.every((l) => l.densityGPerMl != null) ? [...VOLUME_UNITS, ...MASS_UNITS] : VOLUME_UNITS;
  return (
    <form onSubmit={submit} noValidate className="print-hidden flex flex-col gap-4">
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      <SelectField label="Amounts poured are in" fieldClassName="max-w-xs" {...register("actualUnit")}>
        {units.map((u) => (
          <option key={u.value} value={u.value}>
            {u.label}
          </option>
        ))}
      </SelectField>
      <ul className="flex flex-col gap-3">
        {sheet.lines.map((l, i) => {
          const lineErrors = (errors.lines?.[i] ?? {}) as Record<string, { message?: string }>;
          return (
            <li key={l.id} className="grid gap-3 rounded-lg border border-primer-200 bg-white p-3 sm:grid-cols-[minmax(0,1fr)_minmax(0,1.3fr)_10rem] sm:items-start">
              <div>
                <p className="text-base font-semibold">{l.label}</p>
                <p className="text-xs text-primer-700">
                  <span className="font-mono">{l.materialCode}</span> {l.materialName}
                </p>
              </div>
              <SelectField label={`Lot for ${l.label}`} error={lineErrors.lotId?.message} {...register(`lines.${i}.lotId`)}>
                <option value="">Not from a tracked lot</option>
                {l.lots.map((lot) => (
                  <option key={lot.id} value={lot.id} disabled={lot.quantityOnHand <= 0}>
                    {lot.lotNumber} · {formatAmount(lot.quantityOnHand, lot.purchaseUnit, 3)} left{lot.expired ? " · EXPIRED" : ""}
                    {lot.id === l.suggestedLotId ? " · use first" : ""}
                  </option>
                ))}
              </SelectField>
              <div className="flex flex-col gap-1.5">
                <label htmlFor={`actual-${l.id}`} className="text-sm font-semibold">
                  Poured ({unitSymbol(unit)})
                </label>
                <input id={`actual-${l.id}`} inputMode="decimal" autoComplete="off" aria-invalid={lineErrors.actual ? true : undefined} className={controlClasses} {...register(`lines.${i}.actual`)} />
                {lineErrors.actual?.message ? <p className="text-sm font-medium text-red-800">{lineErrors.actual.message}</p> : null}
              </div>
            </li>
          );
        })}
      </ul>
      <div>
        <Button type="submit" size="lg" pending={isSubmitting} icon={<Check aria-hidden className="size-5" />}>
          Record as mixed
        </Button>
        <p className="mt-2 text-sm text-primer-700">Recording takes the amounts from stock, starts the pot-life clock and locks this plan version.</p>
      </div>
    </form>
  );
}

export function SheetCautions({ sheet }: { sheet: MixSheetDto }) {
  return <SafetyCautions cautions={sheet.cautions} />;
}
