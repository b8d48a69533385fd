import type { PortalInspectionDto } from "@shared/schemas/inspection.schema";
import { formatDate } from "@/utils/format-date";

/** What the shop found when it looked the parts over before quoting: findings in words and the photos it shared. */
export function PortalInspection({ inspection }: { inspection: PortalInspectionDto }) {
  return (
    <section aria-labelledby="inspection-heading" className="flex flex-col gap-3">
      <div>
        <h2 id="inspection-heading" className="text-lg font-semibold text-ink-950">
          What we found when we looked your parts over
        </h2>
        <p className="text-sm text-primer-700">Inspected {formatDate(inspection.inspectedAt.slice(0, 10))}</p>
      </div>
      {inspection.summary ? <p className="whitespace-pre-line text-ink-900">{inspection.summary}</p> : null}
      <ul className="flex flex-col gap-3">
        {inspection.items.map((item, i) => (
          <li key={i} className="rounded-xl border border-primer-200 bg-white p-4">
            <h3 className="font-semibold text-ink-950">{item.name}</h3>
            <dl className="mt-1 grid gap-x-4 gap-y-0.5 text-sm sm:grid-cols-[auto_1fr]">
              <dt className="text-primer-700">Finish on it now</dt>
              <dd className="text-ink-950">{item.existingFinish}</dd>
              {item.solventTest ? (
                <>
                  <dt className="text-primer-700">Solvent test</dt>
                  <dd className="text-ink-950">{item.solventTest}</dd>
                </>
              ) : null}
              <dt className="text-primer-700">Found</dt>
              <dd className="text-ink-950">{item.findings.length ? item.findings.join("; ") : "Nothing to repair"}</dd>
              {item.measuredArea != null ? (
                <>
                  <dt className="text-primer-700">Measured</dt>
                  <dd className="text-ink-950 tabular-nums">
                    {item.measuredArea} {item.areaUnit === "ft2" ? "sq ft" : "m²"}
                  </dd>
                </>
              ) : null}
            </dl>
            {item.photos.length ? (
              <ul className="mt-3 grid grid-cols-[repeat(auto-fill,minmax(7rem,1fr))] gap-2">
                {item.photos.map((p) => (
                  <li key={p.id}>
                    <a href={p.url} target="_blank" rel="noreferrer" className="block">
                      <img src={p.thumbUrl} alt={p.caption ?? `Photo of ${item.name}`} className="aspect-square w-full rounded-lg border border-primer-300 object-cover" loading="lazy" />
                    </a>
                    {p.caption ? <p className="mt-1 text-xs text-primer-800">{p.caption}</p> : null}
                  </li>
                ))}
              </ul>
            ) : null}
          </li>
        ))}
      </ul>
    </section>
  );
}
