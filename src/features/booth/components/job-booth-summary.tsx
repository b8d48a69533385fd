import { useQuery } from "@tanstack/react-query";
import { ClipboardCheck, Printer, SprayCan, TriangleAlert } from "lucide-react";
import { PREP_STATUS_LABELS } from "@shared/domain/prep";
import { Alert } from "@/components/ui/alert";
import { ButtonLink } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { formatDateTime } from "@/utils/format-date";
import { boothQueries } from "../api/booth.queries";
import { TimingOverrides } from "./timing-windows";

/** On the job page: how far the job is at the booth, prep sign-offs, any spraying before sign-off, and the links. */
export function JobBoothSummary({ jobId, paths }: { jobId: number; paths: { booth: string; prep: string; ticket: string } }) {
  const card = useQuery(boothQueries.card(jobId));
  const data = card.data;
  const sprayLayers = data?.layers.filter((l) => !l.isPrep) ?? [];
  const doneLayers = sprayLayers.filter((l) => l.status === "done").length;
  return (
    <Panel
      title="Booth"
      titleId="job-booth-heading"
      actions={
        <>
          <ButtonLink to={paths.booth} icon={<SprayCan aria-hidden className="size-4" />}>
            Booth card
          </ButtonLink>
          <ButtonLink to={paths.prep} variant="secondary" icon={<ClipboardCheck aria-hidden className="size-4" />}>
            Prep records
          </ButtonLink>
          <ButtonLink to={paths.ticket} variant="secondary" icon={<Printer aria-hidden className="size-4" />}>
            Job ticket
          </ButtonLink>
        </>
      }
    >
      {card.error ? (
        <Alert tone="error">{card.error.message}</Alert>
      ) : !data ? (
        <p className="text-sm text-primer-700">Loading…</p>
      ) : (
        <div className="flex flex-col gap-3">
          <p className="text-base text-ink-950">
            {data.plan ? (
              <>
                {doneLayers} of {sprayLayers.length} layers sprayed
                {data.next.state === "spray" ? ` · next: coat ${data.next.coat} of ${data.next.of} of ${data.next.layerName}` : data.next.state === "done" ? " · every coat logged" : ""}
              </>
            ) : (
              "No finish plan yet."
            )}
          </p>
          <ul className="flex flex-wrap gap-2" aria-label="Prep of each item">
            {data.items.map((i) => (
              <li key={i.id} className="rounded-full bg-primer-100 px-3 py-1 text-sm text-ink-950">
                {i.name}: <span className="font-semibold">{PREP_STATUS_LABELS[i.prepStatus]}</span>
              </li>
            ))}
          </ul>
          {data.prepOverrides.map((o) => (
            <Alert key={o.coatLogId} tone="warning" title="Sprayed before prep sign-off">
              <p className="flex items-start gap-1.5">
                <TriangleAlert aria-hidden className="mt-0.5 size-4 shrink-0" />
                {o.byName ?? "Former user"}, {formatDateTime(o.at)}: {o.reason}
              </p>
            </Alert>
          ))}
          <TimingOverrides card={data} />
        </div>
      )}
    </Panel>
  );
}
