import { describeAuditChange } from "../audit-words";

/** Before → after in words, one line per changed field; a creation shows only "after", a deletion only "before". */
export function AuditChange({ before, after }: { before: unknown; after: unknown }) {
  const rows = describeAuditChange(before, after);
  if (rows.length === 0) return <span className="text-primer-700">{before == null && after == null ? "No values recorded" : "No field changes"}</span>;
  return (
    <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-3 gap-y-1">
      {rows.map((r) => (
        <div key={r.label} className="contents">
          <dt className="font-semibold text-ink-900">{r.label}</dt>
          <dd className="break-words">
            {r.before !== undefined ? <span className="text-primer-700 line-through decoration-primer-400">{r.before}</span> : null}
            {r.before !== undefined && r.after !== undefined ? (
              <>
                <span aria-hidden className="px-1.5 text-primer-600">→</span>
                <span className="sr-only"> changed to </span>
              </>
            ) : null}
            {r.after !== undefined ? <span className="font-medium text-ink-950">{r.after}</span> : null}
          </dd>
        </div>
      ))}
    </dl>
  );
}
