import { useMemo, useState } from "react";
import { Controller, useFieldArray, useForm, useWatch, type Control, type FieldErrors, type Path, type UseFormRegister } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { ArrowDown, ArrowUp, Plus, Trash2 } from "lucide-react";
import {
  computeQuoteTotals,
  formatCents,
  QUOTE_LINE_KIND_LABELS,
  TAXABLE_KINDS,
  type QuoteLine,
  type QuoteLineKind,
  type TaxableKind,
} from "@shared/quote/index";
import { QUOTE_LINE_KIND_HINT, updateQuoteInputSchema, type QuoteDetailDto, type QuoteVersionDto } from "@shared/schemas/quote.schema";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { LeaveGuard } from "@/components/ui/leave-guard";
import { Button } from "@/components/ui/button";
import { MultiChoice, SingleChoice } from "@/components/ui/choice-group";
import { MoneyField } from "@/components/ui/form/money-field";
import { SelectField } from "@/components/ui/form/select-field";
import { TextField } from "@/components/ui/form/text-field";
import { TextareaField } from "@/components/ui/form/textarea-field";
import { Panel } from "@/components/ui/panel";
import { cn } from "@/utils/cn";
import { QuoteTotalsList } from "./quote-totals";
import { emptyToNull } from "@/lib/form-values";

type FormIn = z.input<typeof updateQuoteInputSchema>;
type FormOut = z.output<typeof updateQuoteInputSchema>;
type LineIn = NonNullable<FormIn["lines"]>[number];

const KIND_TONE: Record<QuoteLineKind, string> = {
  labour: "bg-ink-50 text-ink-800 ring-ink-200",
  materials: "bg-candy-50 text-candy-800 ring-candy-200",
  supplies: "bg-flake-50 text-flake-800 ring-flake-300",
  sublet: "bg-teal-50 text-teal-900 ring-teal-300",
  discount: "bg-emerald-50 text-emerald-900 ring-emerald-300",
};

function toFormValues(v: QuoteVersionDto, editVersion: number): FormIn {
  return {
    editVersion,
    lines: v.lines.map((l) => ({ ...l })),
    taxPercent: v.taxPercent,
    taxedKinds: v.taxedKinds,
    taxRounding: v.taxRounding,
    depositPercent: v.depositPercent,
    validUntil: v.validUntil,
    intro: v.intro ?? "",
    terms: v.terms ?? "",
    finishText: v.finishText ?? "",
  };
}

const asNumber = (v: unknown): number | null => {
  if (v === "" || v == null) return null;
  const n = typeof v === "number" ? v : Number(String(v).replace(/,/g, ""));
  return Number.isFinite(n) ? n : null;
};

/** What the form holds (strings while typing) as lines the shared totals function can read. */
function previewLine(l: LineIn): QuoteLine {
  return {
    kind: l.kind,
    description: l.description ?? "",
    hours: asNumber(l.hours),
    rateCents: asNumber(l.rateCents),
    costCents: asNumber(l.costCents),
    markupPercent: asNumber(l.markupPercent),
    basis: l.basis ?? null,
    percent: asNumber(l.percent),
    amountCents: asNumber(l.amountCents),
  };
}

function newLine(kind: QuoteLineKind, defaults: { rateCents: number; markupPercent: number; suppliesPercent: number }): LineIn {
  switch (kind) {
    case "labour":
      return { kind, description: "", hours: "", rateCents: defaults.rateCents };
    case "materials":
      return { kind, description: "", costCents: null, markupPercent: defaults.markupPercent };
    case "supplies":
      return { kind, description: "Shop supplies", basis: "percent", percent: defaults.suppliesPercent };
    case "sublet":
      return { kind, description: "", amountCents: null };
    case "discount":
      return { kind, description: "Discount", basis: "fixed", amountCents: null };
  }
}


/**
 * The draft editor: lines by kind, tax and deposit, validity and the words the customer reads, with the totals
 * recomputed as you type by the same shared function the server stores them with.
 */
export function QuoteEditor({
  quote,
  onSave,
  busy,
  actions,
}: {
  quote: QuoteDetailDto;
  /** Saves the whole draft; rejects with the API error. Resolves with the saved quote. */
  onSave: (values: FormOut) => Promise<QuoteDetailDto>;
  busy?: boolean;
  /** Extra buttons beside Save (they get `save` to store unsaved edits first). */
  actions?: (save: () => Promise<boolean>, dirty: boolean) => React.ReactNode;
}) {
  const v = quote.current;
  const defaults = useMemo(() => {
    const labour = v.lines.find((l) => l.kind === "labour");
    const mat = v.lines.find((l) => l.kind === "materials");
    const sup = v.lines.find((l) => l.kind === "supplies" && l.basis === "percent");
    return { rateCents: labour?.rateCents ?? 9500, markupPercent: mat?.markupPercent ?? 30, suppliesPercent: sup?.percent ?? 8 };
  }, [v.lines]);
  const [problem, setProblem] = useState<string | null>(null);
  const form = useForm<FormIn, unknown, FormOut>({ resolver: zodResolver(updateQuoteInputSchema), defaultValues: toFormValues(v, quote.editVersion) });
  const {
    control,
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting, isDirty },
  } = form;
  const lines = useFieldArray({ control, name: "lines" });
  const watched = useWatch({ control });
  const totals = useMemo(
    () =>
      computeQuoteTotals((watched.lines ?? []).map((l) => previewLine(l as LineIn)), {
        taxPercent: asNumber(watched.taxPercent) ?? 0,
        taxedKinds: (watched.taxedKinds ?? []) as TaxableKind[],
        depositPercent: asNumber(watched.depositPercent) ?? 0,
        taxRounding: watched.taxRounding ?? "invoice",
      }),
    [watched],
  );

  const fieldNames = (): Path<FormIn>[] => [
    "lines",
    "taxPercent",
    "taxedKinds",
    "taxRounding",
    "depositPercent",
    "validUntil",
    "intro",
    "terms",
    "finishText",
    ...lines.fields.flatMap((_f, i) => ["kind", "description", "hours", "rateCents", "costCents", "markupPercent", "basis", "percent", "amountCents"].map((k) => `lines.${i}.${k}` as Path<FormIn>)),
  ];

  const save = (): Promise<boolean> =>
    new Promise((resolve) => {
      void handleSubmit(
        async (values) => {
          setProblem(null);
          try {
            // The version on screen now (it moves on when someone else saved and the quote was refetched).
            const saved = await onSave({ ...values, editVersion: quote.editVersion });
            reset(toFormValues(saved.current, saved.editVersion));
            resolve(true);
          } catch (error) {
            setProblem(applyServerErrors(error, setError, fieldNames()));
            resolve(false);
          }
        },
        () => {
          setProblem("Check the highlighted fields.");
          resolve(false);
        },
      )();
    });

  return (
    <form
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        void save();
      }}
      className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_22rem]"
    >
      <div className="flex min-w-0 flex-col gap-6">
        <LeaveGuard when={isDirty && !isSubmitting} what="this quote" onSave={save} />
        {problem ? <Alert tone="error">{problem}</Alert> : null}
        <Panel title="Lines" titleId="quote-lines-heading">
          {errors.lines?.message || errors.lines?.root?.message ? (
            <Alert tone="error" className="mb-4">
              {errors.lines?.message ?? errors.lines?.root?.message}
            </Alert>
          ) : null}
          {lines.fields.length === 0 ? <p className="mb-4 text-sm text-primer-700">No lines yet. Add labour, materials and supplies below.</p> : null}
          <ol className="flex flex-col gap-3">
            {lines.fields.map((field, i) => (
              <LineRow
                key={field.id}
                index={i}
                count={lines.fields.length}
                control={control}
                register={register}
                errors={errors}
                amountCents={totals.lines[i]?.amountCents ?? 0}
                taxed={totals.lines[i]?.taxed ?? false}
                onRemove={() => lines.remove(i)}
                onMove={(to) => lines.move(i, to)}
              />
            ))}
          </ol>
          <div className="mt-4 flex flex-wrap gap-2" role="group" aria-label="Add a line">
            {(Object.keys(QUOTE_LINE_KIND_LABELS) as QuoteLineKind[]).map((kind) => (
              <Button key={kind} variant="secondary" size="sm" icon={<Plus aria-hidden className="size-4" />} onClick={() => {
                  // Keep the usual order: labour, materials, supplies, sublet, discount.
                  const order = Object.keys(QUOTE_LINE_KIND_LABELS) as QuoteLineKind[];
                  const kinds = (watched.lines ?? []).map((l) => l?.kind as QuoteLineKind);
                  const after = kinds.findIndex((k) => order.indexOf(k) > order.indexOf(kind));
                  if (after < 0) lines.append(newLine(kind, defaults));
                  else lines.insert(after, newLine(kind, defaults));
                }} title={QUOTE_LINE_KIND_HINT[kind]}>
                Add {QUOTE_LINE_KIND_LABELS[kind].toLowerCase()}
              </Button>
            ))}
          </div>
        </Panel>

        <Panel title="For the customer" titleId="quote-words-heading">
          <div className="flex flex-col gap-5">
            <TextareaField
              label="The finish in plain words"
              rows={2}
              hint="Filled from the finish plan; say it the way the customer will understand it."
              error={errors.finishText?.message}
              {...register("finishText")}
            />
            <TextareaField label="Message at the top of the quote" rows={3} error={errors.intro?.message} {...register("intro")} />
            <TextareaField label="Terms" rows={3} error={errors.terms?.message} {...register("terms")} />
          </div>
        </Panel>
      </div>

      <div className="flex flex-col gap-6">
        <Panel title="Totals" titleId="quote-totals-heading">
          <QuoteTotalsList
            live
            totals={totals}
            taxPercent={asNumber(watched.taxPercent) ?? 0}
            taxedKinds={(watched.taxedKinds ?? []) as TaxableKind[]}
            depositPercent={asNumber(watched.depositPercent) ?? 0}
          />
          <p className="mt-3 text-xs text-primer-700">Whole cents; each fraction rounded half-up once. Tax is rounded {watched.taxRounding === "line" ? "per taxed line" : "once on the whole quote"}.</p>
        </Panel>
        <Panel title="Tax, deposit and validity" titleId="quote-terms-heading">
          <div className="flex flex-col gap-5">
            <div className="grid grid-cols-2 gap-4">
              <TextField label="Sales tax (%)" inputMode="decimal" error={errors.taxPercent?.message} {...register("taxPercent", { setValueAs: emptyToNull })} />
              <TextField label="Deposit (%)" inputMode="decimal" error={errors.depositPercent?.message} {...register("depositPercent", { setValueAs: emptyToNull })} />
            </div>
            <Controller
              control={control}
              name="taxedKinds"
              render={({ field }) => (
                <MultiChoice
                  label="Tax applies to"
                  options={TAXABLE_KINDS.map((k) => ({ value: k, label: QUOTE_LINE_KIND_LABELS[k] }))}
                  value={(field.value ?? []) as TaxableKind[]}
                  onChange={field.onChange}
                />
              )}
            />
            <Controller
              control={control}
              name="taxRounding"
              render={({ field }) => (
                <SingleChoice
                  label="Round the tax"
                  options={[
                    { value: "invoice", label: "Once per quote" },
                    { value: "line", label: "Per line" },
                  ]}
                  value={field.value ?? "invoice"}
                  onChange={field.onChange}
                />
              )}
            />
            <TextField label="Valid until" type="date" error={errors.validUntil?.message} {...register("validUntil")} />
          </div>
        </Panel>
        <div className="flex flex-wrap gap-2">
          <Button type="submit" size="lg" pending={isSubmitting || busy} disabled={!isDirty}>
            {isDirty ? "Save draft" : "Saved"}
          </Button>
          {actions?.(save, isDirty)}
        </div>
      </div>
    </form>
  );
}

function LineRow({
  index,
  count,
  control,
  register,
  errors,
  amountCents,
  taxed,
  onRemove,
  onMove,
}: {
  index: number;
  count: number;
  control: Control<FormIn, unknown, FormOut>;
  register: UseFormRegister<FormIn>;
  errors: FieldErrors<FormIn>;
  amountCents: number;
  taxed: boolean;
  onRemove: () => void;
  onMove: (to: number) => void;
}) {
  const kind = useWatch({ control, name: `lines.${index}.kind` }) as QuoteLineKind;
  const basis = useWatch({ control, name: `lines.${index}.basis` });
  const e = errors.lines?.[index];
  const n = index + 1;
  const label = (text: string) => (
    <>
      <span className="sr-only">Line {n} </span>
      {text}
    </>
  );
  return (
    <li className="rounded-lg border border-primer-200 bg-primer-50/50 p-3" aria-label={`Line ${n}: ${QUOTE_LINE_KIND_LABELS[kind]}`}>
      <div className="flex flex-wrap items-start gap-3">
        <span className={cn("mt-8 inline-flex rounded-full px-2.5 py-0.5 text-xs font-semibold ring-1 ring-inset", KIND_TONE[kind])}>{QUOTE_LINE_KIND_LABELS[kind]}</span>
        <TextField label={label("Description")} fieldClassName="min-w-[14rem] flex-1" error={e?.description?.message} {...register(`lines.${index}.description`)} />
        <div className="ml-auto flex flex-col items-end">
          <span className="text-sm font-semibold text-ink-950">Amount</span>
          <span className="mt-2 min-h-11 text-right text-base font-semibold tabular-nums text-ink-950">
            {formatCents(amountCents)}
            {taxed ? <span className="ml-1 text-xs font-medium text-primer-700">+ tax</span> : null}
          </span>
        </div>
      </div>
      <div className="mt-3 flex flex-wrap items-end gap-3">
        {kind === "labour" ? (
          <>
            <TextField label={label("Hours")} inputMode="decimal" fieldClassName="w-28" error={e?.hours?.message} {...register(`lines.${index}.hours`, { setValueAs: emptyToNull })} />
            <Controller
              control={control}
              name={`lines.${index}.rateCents`}
              render={({ field }) => (
                <MoneyField label={label("Rate")} suffix="/h" fieldClassName="w-40" value={field.value as number | null} onChange={field.onChange} onBlur={field.onBlur} error={e?.rateCents?.message} />
              )}
            />
          </>
        ) : null}
        {kind === "materials" ? (
          <>
            <Controller
              control={control}
              name={`lines.${index}.costCents`}
              render={({ field }) => (
                <MoneyField label={label("Shop cost")} fieldClassName="w-40" value={field.value as number | null} onChange={field.onChange} onBlur={field.onBlur} error={e?.costCents?.message} hint="Never shown to the customer" />
              )}
            />
            <TextField label={label("Markup (%)")} inputMode="decimal" fieldClassName="w-32" error={e?.markupPercent?.message} {...register(`lines.${index}.markupPercent`, { setValueAs: emptyToNull })} />
          </>
        ) : null}
        {kind === "supplies" || kind === "discount" ? (
          <>
            <SelectField label={label("Worked out as")} fieldClassName="w-52" error={e?.basis?.message} {...register(`lines.${index}.basis`)}>
              <option value="percent">{kind === "supplies" ? "Percent of labour" : "Percent of the charges"}</option>
              <option value="fixed">Fixed amount</option>
            </SelectField>
            {basis === "percent" ? (
              <TextField label={label("Percent")} inputMode="decimal" fieldClassName="w-28" error={e?.percent?.message} {...register(`lines.${index}.percent`, { setValueAs: emptyToNull })} />
            ) : (
              <Controller
                control={control}
                name={`lines.${index}.amountCents`}
                render={({ field }) => (
                  <MoneyField label={label("Amount")} fieldClassName="w-40" value={field.value as number | null} onChange={field.onChange} onBlur={field.onBlur} error={e?.amountCents?.message} />
                )}
              />
            )}
          </>
        ) : null}
        {kind === "sublet" ? (
          <Controller
            control={control}
            name={`lines.${index}.amountCents`}
            render={({ field }) => (
              <MoneyField label={label("Amount")} fieldClassName="w-40" value={field.value as number | null} onChange={field.onChange} onBlur={field.onBlur} error={e?.amountCents?.message} />
            )}
          />
        ) : null}
        <div className="ml-auto flex gap-1">
          <Button variant="ghost" size="sm" disabled={index === 0} onClick={() => onMove(index - 1)} aria-label={`Move line ${n} up`}>
            <ArrowUp aria-hidden className="size-4" />
          </Button>
          <Button variant="ghost" size="sm" disabled={index === count - 1} onClick={() => onMove(index + 1)} aria-label={`Move line ${n} down`}>
            <ArrowDown aria-hidden className="size-4" />
          </Button>
          <Button variant="ghost" size="sm" onClick={onRemove} aria-label={`Remove line ${n}`}>
            <Trash2 aria-hidden className="size-4" />
          </Button>
        </div>
      </div>
    </li>
  );
}
