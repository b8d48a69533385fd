import { useId, type ReactNode } from "react";
import { Link } from "react-router";
import { Download, Printer, TriangleAlert } from "lucide-react";
import { LAYER_KIND_LABELS } from "@shared/domain/layers";
import { MATERIAL_CATEGORY_LABELS } from "@shared/domain/materials";
import type { ComplianceDto, ComplianceQuery, VocMass } from "@shared/schemas/compliance.schema";
import { Alert } from "@/components/ui/alert";
import { Button, buttonClasses } from "@/components/ui/button";
import { paths } from "@/config/paths";
import { cn } from "@/utils/cn";
import { formatDateTime } from "@/utils/format-date";
import { formatNumber } from "@/utils/format-quantity";
import { complianceCsvUrl } from "../api/compliance.queries";
import { LogSolventUseForm, SolventUseList } from "./solvent-use-panel";

const monthFormat = new Intl.DateTimeFormat(undefined, { month: "long", year: "numeric" });
const formatMonth = (ym: string) => {
  const m = /^(\d{4})-(\d{2})$/.exec(ym);
  return m ? monthFormat.format(new Date(Number(m[1]), Number(m[2]) - 1, 1)) : ym;
};
const n = (v: number, digits = 2) => formatNumber(v, digits);
const kgLb = (m: VocMass) => `${n(m.kg, 3)} kg · ${n(m.lb, 3)} lb`;

const th = "border-b border-primer-200 px-3 py-2 font-semibold whitespace-nowrap";
const td = "px-3 py-2 align-top";
const num = "text-right tabular-nums whitespace-nowrap";

function OverFlag({ over, label }: { over: boolean; label: string }) {
  return over ? (
    <span className="inline-flex items-center gap-1 rounded-full bg-red-100 px-2.5 py-0.5 text-xs font-bold whitespace-nowrap text-red-900 ring-1 ring-red-700 ring-inset">
      <TriangleAlert aria-hidden className="size-3.5" />
      {label}
    </span>
  ) : (
    <span className="text-primer-700">No</span>
  );
}

function Section({ title, children, className, actions }: { title: string; children: ReactNode; className?: string; actions?: ReactNode }) {
  const id = useId();
  return (
    <section aria-labelledby={id} className={cn("rounded-xl border border-primer-200 bg-white shadow-card print:break-inside-avoid print:border-0 print:shadow-none", className)}>
      <div className="flex flex-wrap items-center justify-between gap-2 border-b border-primer-200 px-4 py-3 sm:px-5 print:px-0">
        <h2 id={id} className="text-lg font-semibold text-ink-950">
          {title}
        </h2>
        {actions}
      </div>
      {children}
    </section>
  );
}

/** Everything for one date range: totals, months with cap flags, categories, and every batch with its limit flag. */
export function ComplianceView({ log, range }: { log: ComplianceDto; range: ComplianceQuery }) {
  const capNote =
    log.monthlyCapKg === null && log.yearlyCapKg === null
      ? "No monthly or yearly cap entered."
      : [log.monthlyCapKg !== null ? `monthly cap ${n(log.monthlyCapKg, 3)} kg` : null, log.yearlyCapKg !== null ? `yearly cap ${n(log.yearlyCapKg, 3)} kg` : null]
          .filter(Boolean)
          .join(", ");
  const overMonths = log.months.filter((m) => m.overCap);
  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap gap-2 print:hidden">
        <a href={complianceCsvUrl(range)} download className={buttonClasses({ variant: "secondary" })}>
          <Download aria-hidden className="size-4" />
          Download CSV (batches)
        </a>
        <Button variant="secondary" onClick={() => window.print()} icon={<Printer aria-hidden className="size-4" />}>
          Print monthly summary
        </Button>
      </div>

      {log.totals.batchesOverLimit > 0 || overMonths.length > 0 || log.yearToDate?.overCap ? (
        <Alert tone="warning" title="Over the shop's own limits">
          {log.totals.batchesOverLimit > 0 ? <p>{log.totals.batchesOverLimit} batch(es) over their coating category's limit.</p> : null}
          {overMonths.length > 0 ? <p>Over the monthly cap: {overMonths.map((m) => formatMonth(m.month)).join(", ")}.</p> : null}
          {log.yearToDate?.overCap ? <p>{log.yearToDate.year} so far is over the yearly cap.</p> : null}
        </Alert>
      ) : null}

      <Section title="Totals for the range">
        <dl className="grid gap-4 p-4 sm:grid-cols-2 sm:p-5 lg:grid-cols-4 print:grid-cols-4 print:px-0">
          <Total label="Batches" value={String(log.totals.batches)} note={`${log.totals.batchesOverLimit} over a limit`} />
          <Total label="Volume mixed" value={`${n(log.totals.volumeL, 2)} L`} note={`${n(log.totals.volumeGal, 3)} gal`} />
          <Total label="VOC emitted" value={`${n(log.totals.vocMass.kg, 3)} kg`} note={`${n(log.totals.vocMass.lb, 3)} lb`} />
          {log.yearToDate ? (
            <Total label={`VOC in ${log.yearToDate.year} so far`} value={`${n(log.yearToDate.vocMass.kg, 3)} kg`} note={capNote} />
          ) : (
            <Total label="Yearly cap" value="None entered" note={log.monthlyCapKg !== null ? `Monthly cap ${n(log.monthlyCapKg, 3)} kg` : "No monthly cap either"} />
          )}
        </dl>
      </Section>

      <Section title="Monthly summary">
        <div className="overflow-x-auto">
          <table className="w-full min-w-[40rem] border-collapse text-left text-sm">
            <caption className="sr-only">VOC by month, with the monthly cap</caption>
            <thead className="bg-primer-100">
              <tr>
                <th scope="col" className={th}>Month</th>
                <th scope="col" className={cn(th, "text-right")}>Batches</th>
                <th scope="col" className={cn(th, "text-right")}>Volume</th>
                <th scope="col" className={cn(th, "text-right")}>VOC</th>
                <th scope="col" className={cn(th, "text-right")}>Monthly cap</th>
                <th scope="col" className={th}>Over cap</th>
                <th scope="col" className={cn(th, "text-right")}>Batches over limit</th>
              </tr>
            </thead>
            <tbody>
              {log.months.length === 0 ? (
                <tr>
                  <td colSpan={7} className="px-3 py-6 text-center text-primer-700">No batches in this range.</td>
                </tr>
              ) : (
                log.months.map((m) => (
                  <tr key={m.month} className={cn("border-b border-primer-100", m.overCap && "bg-red-50")}>
                    <th scope="row" className={cn(td, "font-semibold")}>{formatMonth(m.month)}</th>
                    <td className={cn(td, num)}>{m.batches}</td>
                    <td className={cn(td, num)}>{n(m.volumeL)} L · {n(m.volumeGal, 3)} gal</td>
                    <td className={cn(td, num)}>{kgLb(m.vocMass)}</td>
                    <td className={cn(td, num)}>{m.capKg === null ? "—" : `${n(m.capKg, 3)} kg`}</td>
                    <td className={td}><OverFlag over={m.overCap} label="Over cap" /></td>
                    <td className={cn(td, num)}>{m.batchesOverLimit}</td>
                  </tr>
                ))
              )}
            </tbody>
          </table>
        </div>
      </Section>

      <Section title="By material category">
        <div className="overflow-x-auto">
          <table className="w-full min-w-[32rem] border-collapse text-left text-sm">
            <caption className="sr-only">Volume and VOC by material category</caption>
            <thead className="bg-primer-100">
              <tr>
                <th scope="col" className={th}>Category</th>
                <th scope="col" className={cn(th, "text-right")}>Volume (L)</th>
                <th scope="col" className={cn(th, "text-right")}>Volume (gal)</th>
                <th scope="col" className={cn(th, "text-right")}>VOC (kg)</th>
                <th scope="col" className={cn(th, "text-right")}>VOC (lb)</th>
              </tr>
            </thead>
            <tbody>
              {log.categories.length === 0 ? (
                <tr>
                  <td colSpan={5} className="px-3 py-6 text-center text-primer-700">No batches in this range.</td>
                </tr>
              ) : (
                log.categories.map((c) => (
                  <tr key={c.category} className="border-b border-primer-100">
                    <th scope="row" className={cn(td, "font-semibold")}>{MATERIAL_CATEGORY_LABELS[c.category]}</th>
                    <td className={cn(td, num)}>{n(c.volumeL, 3)}</td>
                    <td className={cn(td, num)}>{n(c.volumeGal, 3)}</td>
                    <td className={cn(td, num)}>{n(c.vocMass.kg, 3)}</td>
                    <td className={cn(td, num)}>{n(c.vocMass.lb, 3)}</td>
                  </tr>
                ))
              )}
            </tbody>
          </table>
        </div>
      </Section>

      <Section title="Prep and cleaning solvent (outside batches)">
        <SolventUseList uses={log.solventUses} />
        <LogSolventUseForm />
      </Section>

      <Section title="Limits entered by the shop" className="print:hidden">
        <div className="p-4 text-sm sm:p-5">
          {log.limits.length === 0 ? (
            <p>No limits entered, so no batch is flagged. The owner enters them in Settings.</p>
          ) : (
            <ul className="flex flex-wrap gap-2">
              {log.limits.map((l) => (
                <li key={l.layerKind} className="rounded-lg bg-primer-100 px-3 py-1.5">
                  <span className="font-semibold">{LAYER_KIND_LABELS[l.layerKind]}</span>: {n(l.limitGPerL, 1)} g/L ({n(l.limitLbPerGal, 3)} lb/gal)
                </li>
              ))}
            </ul>
          )}
        </div>
      </Section>

      <Section title="Batches" className="print:hidden">
        <div className="overflow-x-auto">
          <table aria-label="VOC batches" className="w-full min-w-[72rem] border-collapse text-left text-sm">
            <thead className="bg-primer-100">
              <tr>
                <th scope="col" className={th}>Mixed</th>
                <th scope="col" className={th}>Job</th>
                <th scope="col" className={th}>Layer</th>
                <th scope="col" className={th}>Coating category</th>
                <th scope="col" className={cn(th, "text-right")}>Volume</th>
                <th scope="col" className={cn(th, "text-right")}>VOC content</th>
                <th scope="col" className={cn(th, "text-right")}>VOC mass</th>
                <th scope="col" className={cn(th, "text-right")}>Shop limit</th>
                <th scope="col" className={th}>Over limit</th>
              </tr>
            </thead>
            <tbody>
              {log.batches.length === 0 ? (
                <tr>
                  <td colSpan={9} className="px-3 py-6 text-center text-primer-700">No batches were recorded in this range.</td>
                </tr>
              ) : (
                log.batches.map((b) => (
                  <tr key={b.id} className={cn("border-b border-primer-100 last:border-b-0", b.overLimit && "bg-red-50")}>
                    <td className={cn(td, "whitespace-nowrap")}>{formatDateTime(b.mixedAt)}</td>
                    <th scope="row" className={cn(td, "min-w-[14rem] font-normal")}>
                      <Link to={paths.job(b.jobId)} className="font-semibold text-ink-900 underline decoration-primer-300 underline-offset-2 hover:decoration-ink-700">
                        #{b.jobId} {b.jobTitle}
                      </Link>
                    </th>
                    <td className={td}>{b.layerName}</td>
                    <td className={td}>{LAYER_KIND_LABELS[b.layerKind]}</td>
                    <td className={cn(td, num)}>
                      {n(b.volumeL, 3)} L<br />
                      <span className="text-primer-700">{n(b.volumeGal, 4)} gal</span>
                    </td>
                    <td className={cn(td, num)}>
                      {b.voc ? (
                        <>
                          {n(b.voc.gPerL, 1)} g/L<br />
                          <span className="text-primer-700">{n(b.voc.lbPerGal, 3)} lb/gal</span>
                        </>
                      ) : (
                        <span className="text-primer-700">No VOC on record</span>
                      )}
                    </td>
                    <td className={cn(td, num)}>
                      {n(b.vocMass.kg, 4)} kg<br />
                      <span className="text-primer-700">{n(b.vocMass.lb, 4)} lb</span>
                    </td>
                    <td className={cn(td, num)}>{b.limitGPerL === null ? <span className="text-primer-700">None entered</span> : `${n(b.limitGPerL, 1)} g/L`}</td>
                    <td className={td}>
                      <OverFlag over={b.overLimit} label="Over limit" />
                    </td>
                  </tr>
                ))
              )}
            </tbody>
          </table>
        </div>
      </Section>
    </div>
  );
}

function Total({ label, value, note }: { label: string; value: string; note?: string }) {
  return (
    <div>
      <dt className="text-sm font-medium text-primer-700">{label}</dt>
      <dd className="mt-0.5 text-xl font-bold text-ink-950 tabular-nums">{value}</dd>
      {note ? <dd className="text-sm text-primer-700">{note}</dd> : null}
    </div>
  );
}

