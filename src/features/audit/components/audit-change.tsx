import { formatCents } from "@shared/quote/index";

type Plain = Record<string, unknown>;
const isPlain = (v: unknown): v is Plain => typeof v === "object" && v !== null && !Array.isArray(v);

/** "labourRateCents" → "labour rate"; "taxPercent" → "tax %". */
export function fieldLabel(key: string): string {
  const base = key
    .replace(/Cents$/, "")
    .replace(/Percent$/, " %")
    .replace(/([a-z0-9])([A-Z])/g, "$1 $2")
    .replace(/_/g, " ")
    .toLowerCase()
    .trim();
  return base.charAt(0).toUpperCase() + base.slice(1);
}

/** One value for people: money keys in dollars, empty as "—", lists and objects as compact JSON. */
export function formatValue(key: string, value: unknown): string {
  if (value === null || value === undefined || value === "") return "—";
  if (typeof value === "number" && /cents$/i.test(key)) return formatCents(value);
  if (typeof value === "boolean") return value ? "yes" : "no";
  if (typeof value === "string" || typeof value === "number") return String(value);
  const text = Array.isArray(value)
    ? value.map((v) => (typeof v === "string" || typeof v === "number" ? String(v) : JSON.stringify(v))).join("; ")
    : Object.entries(value as Plain)
        .map(([k, v]) => `${fieldLabel(k)}: ${formatValue(k, v)}`)
        .join(", ");
  return text.length > 160 ? `${text.slice(0, 157)}…` : text;
}

/** Before → after, one line per changed field; a creation shows only "after", a deletion only "before". */
export function AuditChange({ before, after }: { before: unknown; after: unknown }) {
  if (!isPlain(before) && !isPlain(after)) {
    if (before == null && after == null) return <span className="text-primer-700">No values recorded</span>;
    return (
      <span className="break-words">
        {formatValue("", before)} <span aria-hidden>→</span>
        <span className="sr-only"> changed to </span> {formatValue("", after)}
      </span>
    );
  }
  const b = isPlain(before) ? before : {};
  const a = isPlain(after) ? after : {};
  const keys = [...new Set([...Object.keys(b), ...Object.keys(a)])];
  if (keys.length === 0) return <span className="text-primer-700">No field changes</span>;
  return (
    <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-3 gap-y-1">
      {keys.map((k) => (
        <div key={k} className="contents">
          <dt className="font-semibold text-ink-900">{fieldLabel(k)}</dt>
          <dd className="break-words">
            {k in b ? <span className="text-primer-700 line-through decoration-primer-400">{formatValue(k, b[k])}</span> : null}
            {k in b && k in a ? (
              <>
                <span aria-hidden className="px-1.5 text-primer-600">→</span>
                <span className="sr-only"> changed to </span>
              </>
            ) : null}
            {k in a ? <span className="font-medium text-ink-950">{formatValue(k, a[k])}</span> : null}
          </dd>
        </div>
      ))}
    </dl>
  );
}
