import { useQuery } from "@tanstack/react-query";
import { useSearchParams } from "react-router";
import { complianceQuerySchema } from "@shared/schemas/compliance.schema";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";
import { Spinner } from "@/components/ui/spinner";
import { AccessGate } from "@/features/auth/components/access-gate";
import { complianceQueries } from "@/features/compliance/api/compliance.queries";
import { ComplianceView } from "@/features/compliance/components/compliance-view";
import { DateRangeFields } from "@/features/compliance/components/date-range-fields";
import { VocFactorsNote, VocLimitsNote } from "@/features/compliance/components/voc-notes";
import { formatDate } from "@/utils/format-date";

// On paper: no navigation or controls, only the summary (the batch list is in the CSV).
const PRINT_CSS = `@media print {
  header, nav, #skip-link, .skip-link { display: none !important; }
  body { background: #fff !important; }
  .min-h-dvh { min-height: 0 !important; }
  main { padding: 0 !important; font-size: 11px; }
  main table { min-width: 0 !important; font-size: 10.5px; }
  main th, main td { padding-top: 2px !important; padding-bottom: 2px !important; }
  main h1 { font-size: 20px !important; }
  main h2 { font-size: 14px !important; }
  main .gap-6 { gap: 8px !important; }
  main .mb-6, main .mt-6 { margin-top: 8px !important; margin-bottom: 8px !important; }
  .fixed { display: none !important; }
  html, body, #root { height: auto !important; min-height: 0 !important; }
  @page { margin: 10mm; }
}`;

export default function ComplianceRoute() {
  return (
    <AccessGate access="office">
      <CompliancePage />
    </AccessGate>
  );
}

function CompliancePage() {
  const [searchParams, setSearchParams] = useSearchParams();
  const year = new Date().getFullYear();
  const from = searchParams.get("from") || `${year}-01-01`;
  const to = searchParams.get("to") || `${year}-12-31`;
  const parsed = complianceQuerySchema.safeParse({ from, to });
  const rangeError = parsed.success ? undefined : parsed.error.issues[0]?.message;
  const { data, isPending, error, isFetching, isPlaceholderData } = useQuery({
    ...complianceQueries.log(parsed.success ? parsed.data : { from, to }),
    enabled: parsed.success,
  });

  return (
    <>
      <style>{PRINT_CSS}</style>
      <PageHeader
        title="VOC log"
        description={
          <>
            Volume and VOC of every recorded mix sheet, against the limits the shop entered. <span className="hidden print:inline">{formatDate(from)} to {formatDate(to)}.</span>
          </>
        }
      />
      <div className="mb-6 flex flex-col gap-4">
        <Alert tone="info" title="The limits are the shop's own">
          <VocLimitsNote />
        </Alert>
        <div className="flex flex-wrap items-end gap-4 print:hidden">
          <DateRangeFields
            from={from}
            to={to}
            error={rangeError}
            onChange={(patch) =>
              setSearchParams(
                (prev) => {
                  const next = new URLSearchParams(prev);
                  for (const [k, v] of Object.entries(patch)) if (v) next.set(k, v);
                  return next;
                },
                { replace: true },
              )
            }
          />
        </div>
      </div>
      {!parsed.success ? null : isPending ? (
        <Spinner label="Loading the VOC log…" />
      ) : error && !data ? (
        <Alert tone="error">{error.message}</Alert>
      ) : data ? (
        <div aria-busy={(isFetching && isPlaceholderData) || undefined}>
          <ComplianceView log={data} range={parsed.data} />
        </div>
      ) : null}
      <VocFactorsNote className="mt-6 rounded-xl border border-primer-200 bg-white p-4 text-sm text-ink-950 shadow-card sm:p-5 print:border-0 print:p-0 print:shadow-none" />
    </>
  );
}
