import { useQuery } from "@tanstack/react-query";
import { Printer, ShieldAlert } from "lucide-react";
import { LAYER_KIND_LABELS } from "@shared/domain/layers";
import { STAGE_LABELS } from "@shared/domain/stages";
import { SUBSTRATE_LABELS, AREA_UNIT_LABELS } from "@shared/domain/substrates";
import { isApiError } from "@/lib/api-client";
import { formatMinutes } from "@shared/domain/duration";
import { Alert } from "@/components/ui/alert";
import { Button, ButtonLink } from "@/components/ui/button";
import { Spinner } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { boothQueries } from "@/features/booth/api/booth.queries";
import { formatDate, formatDateTime } from "@/utils/format-date";
import { InPageNotFound } from "../in-page-not-found";
import { useIdParam } from "@/hooks/use-id-param";

/** Hides the app frame when printing, so only the ticket goes on paper. */
const PRINT_CSS = `@media print {
  header, nav, .no-print { display: none !important; }
  main { padding: 0 !important; }
  body, html { background: #fff !important; }
  .ticket { border: 2px solid #000 !important; box-shadow: none !important; }
}`;

/** A printable job ticket for the booth wall: the job, its layers, and a QR code that opens the booth card. */
export default function JobTicketRoute() {
  const { id, valid } = useIdParam("jobId");
  const ticket = useQuery({ ...boothQueries.ticket(id), enabled: valid });
  if (!valid || (isApiError(ticket.error) && (ticket.error.status === 404 || ticket.error.status === 400)))
    return <InPageNotFound what="Job" backTo={paths.jobs} backLabel="Back to jobs" />;
  if (ticket.error) return <Alert tone="error">{ticket.error.message}</Alert>;
  if (!ticket.data) return <Spinner label="Preparing the ticket…" />;
  const t = ticket.data;
  return (
    <>
      <title>{`Ticket · job #${t.job.id} · Coatwright`}</title>
      <style>{PRINT_CSS}</style>
      <div className="no-print mb-4 flex flex-wrap gap-2">
        <Button size="lg" icon={<Printer aria-hidden className="size-5" />} onClick={() => window.print()}>
          Print ticket
        </Button>
        <ButtonLink to={paths.booth(t.job.id)} variant="secondary" size="lg">
          Booth card
        </ButtonLink>
      </div>
      <article className="ticket mx-auto max-w-3xl rounded-xl border-2 border-ink-900 bg-white p-6 text-ink-950 shadow-card" aria-labelledby="ticket-title">
        <div className="flex flex-wrap items-start justify-between gap-6">
          <div className="min-w-0 flex-1">
            <p className="text-lg font-semibold">Job #{t.job.id}</p>
            <h1 id="ticket-title" className="text-3xl font-bold">
              {t.job.title}
            </h1>
            <p className="mt-1 text-lg">{t.job.customerName}</p>
            <p className="text-base">
              {STAGE_LABELS[t.job.stage]}
              {t.job.dueDate ? ` · due ${formatDate(t.job.dueDate)}` : ""}
              {t.job.assignedPainterName ? ` · painter ${t.job.assignedPainterName}` : ""}
            </p>
          </div>
          <figure className="flex flex-col items-center">
            <img src={t.qrDataUrl} alt={`QR code that opens the booth card: ${t.boothUrl}`} className="size-44" />
            <figcaption className="max-w-44 text-center text-xs break-all">Scan for the booth card · {t.boothUrl}</figcaption>
          </figure>
        </div>
        <h2 className="mt-6 text-xl font-bold">Items</h2>
        <ul className="mt-1 list-disc pl-6 text-base">
          {t.items.map((i) => (
            <li key={i.name}>
              {i.name}: {SUBSTRATE_LABELS[i.substrate]}, {i.surfaceArea} {AREA_UNIT_LABELS[i.areaUnit]}
            </li>
          ))}
        </ul>
        <h2 className="mt-6 text-xl font-bold">Layers</h2>
        {t.layers.length ? (
          <table className="mt-2 w-full border-collapse text-left text-base">
            <thead>
              <tr className="border-b-2 border-ink-900">
                <th scope="col" className="py-1 pr-2">#</th>
                <th scope="col" className="py-1 pr-2">Layer</th>
                <th scope="col" className="py-1 pr-2">Coats</th>
                <th scope="col" className="py-1 pr-2">Flash</th>
                <th scope="col" className="py-1 pr-2">Dry</th>
                <th scope="col" className="py-1 pr-2">Done ✓</th>
              </tr>
            </thead>
            <tbody>
              {t.layers.map((l, i) => (
                <tr key={l.position} className="border-b border-primer-400">
                  <td className="py-2 pr-2">{i + 1}</td>
                  <td className="py-2 pr-2">
                    <span className="font-semibold">{l.name}</span> <span className="text-sm">({LAYER_KIND_LABELS[l.kind]})</span>
                    {l.cautions.length ? (
                      <span className="ml-2 inline-flex items-center gap-1 text-sm font-semibold">
                        <ShieldAlert aria-hidden className="size-4" /> {l.cautions.join(" · ")}
                      </span>
                    ) : null}
                  </td>
                  {l.kind === "prep" ? (
                    <td colSpan={2} className="py-2 pr-2">
                      Sign off each item on the prep record
                    </td>
                  ) : (
                    <>
                      <td className="py-2 pr-2 tabular-nums">{l.coats}</td>
                      <td className="py-2 pr-2 whitespace-nowrap tabular-nums">{formatMinutes(l.flashMinutes)}</td>
                    </>
                  )}
                  <td className="py-2 pr-2 whitespace-nowrap tabular-nums">{formatMinutes(l.dryMinutes)}</td>
                  <td className="py-2 pr-2">☐</td>
                </tr>
              ))}
            </tbody>
          </table>
        ) : (
          <p>No finish plan yet.</p>
        )}
        {t.layers.some((l) => l.cautions.length) ? (
          <p className="mt-4 rounded border-2 border-ink-900 p-3 text-sm">
            <strong>Safety:</strong> layers marked above use isocyanate hardeners or flammable solvents. Use respiratory protection suited to isocyanates (usually supplied air), gloves and eye
            protection; spray only in a ventilated booth; no ignition sources. Follow the product&apos;s safety data sheet, local codes and licensed practice.
          </p>
        ) : null}
        <p className="mt-4 text-xs">Printed {formatDateTime(t.printedAt)}. The booth card has the live timers and the coat log.</p>
      </article>
    </>
  );
}
