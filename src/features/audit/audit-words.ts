import { formatCents, formatPercent, QUOTE_LINE_KIND_LABELS, type QuoteLineKind } from "@shared/quote/index";

/** One changed thing in words: "Line 1 (Prep and paint) · Rate", "$95.00" → "$105.00". A creation has no before. */
export type AuditChangeRow = { label: string; before?: string; after?: string };

type Plain = Record<string, unknown>;
const isPlain = (v: unknown): v is Plain => typeof v === "object" && v !== null && !Array.isArray(v);
const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);
const plural = (n: number, one: string, many: string) => `${Number(n.toFixed(2))} ${n === 1 ? one : many}`;

const LABELS: Record<string, string> = {
  rateCents: "Rate",
  hours: "Hours",
  costCents: "Cost",
  amountCents: "Amount",
  markupPercent: "Markup",
  taxPercent: "Sales tax",
  taxedKinds: "Taxed lines",
  taxRounding: "Tax rounded",
  depositPercent: "Deposit",
  validUntil: "Valid until",
  totalCents: "Total",
  depositCents: "Deposit amount",
  approvedPanelId: "Approved panel",
  jobId: "Job",
  copiedFromPlanId: "Copied from plan",
  layers: "Layers",
  lines: "Lines",
};

/** "labourRateCents" → "Labour rate"; "taxPercent" → "Sales tax"; "shopSuppliesPercent" → "Shop supplies". */
export function fieldLabel(key: string): string {
  if (LABELS[key]) return LABELS[key];
  const base = key
    .replace(/Cents$/, "")
    .replace(/Percent$/, "")
    .replace(/([a-z0-9])([A-Z])/g, "$1 $2")
    .replace(/_/g, " ")
    .toLowerCase()
    .trim();
  return base.charAt(0).toUpperCase() + base.slice(1);
}

const isQuoteLine = (v: unknown): v is Plain & { kind: QuoteLineKind; description: string } =>
  isPlain(v) && typeof v.kind === "string" && v.kind in QUOTE_LINE_KIND_LABELS && typeof v.description === "string";

/** A quote line in a sentence: "Labour: Prep and paint, 10 h × $95.00/h". */
export function quoteLineWords(line: Plain & { kind: QuoteLineKind; description: string }): string {
  const head = `${QUOTE_LINE_KIND_LABELS[line.kind]}: ${line.description || "(no description)"}`;
  const n = (k: string) => (typeof line[k] === "number" ? (line[k] as number) : null);
  switch (line.kind) {
    case "labour":
      return `${head}, ${plural(n("hours") ?? 0, "hour", "hours")} × ${formatCents(n("rateCents") ?? 0)}/h`;
    case "materials":
      return `${head}, ${formatCents(n("costCents") ?? 0)} + ${formatPercent(n("markupPercent") ?? 0)} markup`;
    default:
      return line.basis === "percent" ? `${head}, ${formatPercent(n("percent") ?? 0)}` : `${head}, ${formatCents(n("amountCents") ?? 0)}`;
  }
}

/** One value for people: money keys in dollars, percents with %, hours in h, empty as "—", lists in words. */
export function formatValue(key: string, value: unknown): string {
  if (value === null || value === undefined || value === "") return "—";
  if (typeof value === "number" && /cents$/i.test(key)) return formatCents(value);
  if (typeof value === "number" && /percent$/i.test(key)) return formatPercent(value);
  if (typeof value === "number" && key === "hours") return plural(value, "hour", "hours");
  if (typeof value === "boolean") return value ? "yes" : "no";
  if (typeof value === "string" || typeof value === "number") return String(value);
  if (isQuoteLine(value)) return quoteLineWords(value);
  const text = Array.isArray(value)
    ? value
        .map((v) => (key === "taxedKinds" && typeof v === "string" ? (QUOTE_LINE_KIND_LABELS[v as QuoteLineKind] ?? v).toLowerCase() : formatValue("", v)))
        .join(key === "taxedKinds" ? ", " : "; ")
    : Object.entries(value as Plain)
        .map(([k, v]) => `${fieldLabel(k)}: ${formatValue(k, v)}`)
        .join(", ");
  return text.length > 240 ? `${text.slice(0, 237)}…` : text;
}

/** A list compared item by item: "Line 2 (Paint) · Rate" for a changed field of a quote line, "Layer 3" for a plan layer. */
function listRows(key: string, before: unknown[], after: unknown[]): AuditChangeRow[] {
  const noun = key === "lines" ? "Line" : key === "layers" ? "Layer" : fieldLabel(key);
  const rows: AuditChangeRow[] = [];
  for (let i = 0; i < Math.max(before.length, after.length); i++) {
    const b = before[i];
    const a = after[i];
    if (same(a, b)) continue;
    if (isQuoteLine(b) && isQuoteLine(a) && a.kind === b.kind) {
      const name = `${noun} ${i + 1} (${a.description || b.description})`;
      if (a.description !== b.description) rows.push({ label: `${noun} ${i + 1} · Description`, before: b.description, after: a.description });
      for (const k of [...new Set([...Object.keys(b), ...Object.keys(a)])].filter((k) => k !== "description" && !same(a[k], b[k]))) {
        rows.push({ label: `${name} · ${fieldLabel(k)}`, before: formatValue(k, b[k]), after: formatValue(k, a[k]) });
      }
      continue;
    }
    const row: AuditChangeRow = { label: `${noun} ${i + 1}${b === undefined ? " added" : a === undefined ? " removed" : ""}` };
    if (b !== undefined) row.before = formatValue(key, b);
    if (a !== undefined) row.after = formatValue(key, a);
    rows.push(row);
  }
  return rows;
}

/** Before → after in words, one row per changed field (quote lines and plan layers item by item). */
export function describeAuditChange(before: unknown, after: unknown): AuditChangeRow[] {
  if (!isPlain(before) && !isPlain(after)) {
    if (before == null && after == null) return [];
    return [{ label: "Value", ...(before != null ? { before: formatValue("", before) } : {}), ...(after != null ? { after: formatValue("", after) } : {}) }];
  }
  const b = isPlain(before) ? before : {};
  const a = isPlain(after) ? after : {};
  const rows: AuditChangeRow[] = [];
  for (const k of [...new Set([...Object.keys(b), ...Object.keys(a)])]) {
    if (k in b && k in a && Array.isArray(b[k]) && Array.isArray(a[k]) && (k === "lines" || k === "layers")) {
      rows.push(...listRows(k, b[k] as unknown[], a[k] as unknown[]));
      continue;
    }
    if (k in b && k in a && same(a[k], b[k])) continue;
    const row: AuditChangeRow = { label: fieldLabel(k) };
    if (k in b) row.before = formatValue(k, b[k]);
    if (k in a) row.after = formatValue(k, a[k]);
    rows.push(row);
  }
  return rows;
}

const ENTITY_WORDS: Record<string, string> = {
  quote: "Quote",
  plan: "Finish plan",
  plan_template: "Plan template",
  plan_version: "Plan version",
  material: "Material",
  settings: "Shop settings",
  user: "User",
  payment: "Payment",
  job_colour: "Colour of job",
  booth: "Booth",
  change_order: "Change order",
  job: "Job",
};

/**
 * What was changed, in words: "Material S5-B02 2K urethane clear: created", "Quote 12: new version",
 * "Shop settings: updated" (a material by its stock number when the record carries it, not by its row number).
 */
export function auditSubject(e: { entity: string; entityId: string | null; action: string; before: unknown; after: unknown }): string {
  const noun = ENTITY_WORDS[e.entity] ?? fieldLabel(e.entity);
  const rec = (isPlain(e.after) ? e.after : isPlain(e.before) ? e.before : {}) as Plain;
  const code = e.entity === "material" && typeof rec.code === "string" ? `${rec.code}${typeof rec.name === "string" ? ` ${rec.name}` : ""}` : null;
  const id = e.entity === "settings" ? null : (code ?? e.entityId);
  return `${noun}${id ? ` ${id}` : ""}: ${e.action.replace(/_/g, " ")}`;
}
