import { CHANGE_WAITING } from "@shared/domain/change-orders";
import { useEffect, useState, type ReactNode } from "react";
import { Link } from "react-router";
import { ClipboardCheck, Printer, SquareArrowOutUpRight } from "lucide-react";
import { PREP_STATUS_LABELS } from "@shared/domain/prep";
import { STAGE_LABELS } from "@shared/domain/stages";
import { SUBSTRATE_LABELS } from "@shared/domain/substrates";
import type { BoothDto } from "@shared/schemas/booth.schema";
import { COLOUR_SIGN_OFF_RULE } from "@shared/domain/colour-sign-off";
import { Alert } from "@/components/ui/alert";
import { ButtonLink } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { SafetyCautions } from "@/components/ui/safety-cautions";
import { formatDate } from "@/utils/format-date";
import { cn } from "@/utils/cn";
import { useServerNow } from "../hooks/use-server-now";
import { BatchPanel } from "./batch-panel";
import { CoatLogList } from "./coat-log-list";
import { LayerList } from "./layer-list";
import { NextStepPanel } from "./next-step-panel";
import { TimingOverrides } from "./timing-windows";

export type BoothPaths = { job: string; prep: string; ticket: string; jobPlan: string; mixSheet: (id: number) => string };

/**
 * The painter's screen for one job: the next step in large type with its timers and the one-tap log, the layers in
 * order, the batch, prep status and the log. Built for a tablet in the booth: big targets, high contrast, no hover.
 */
export function BoothCard({ card, receivedAt, paths, queued }: { card: BoothDto; receivedAt: number; paths: BoothPaths; queued?: ReactNode }) {
  const now = useServerNow(card.serverNow, receivedAt);
  const current = card.next.state === "spray" ? card.layers.find((l) => l.id === (card.next as { layerId: number }).layerId) : undefined;
  const mainCautionsVisible = useInView("[data-booth-cautions]", current?.id);
  return (
    <div className="flex flex-col gap-5 pb-24">
      <title>{`Booth · #${card.job.id} ${card.job.title} · Coatwright`}</title>
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div className="min-w-0">
          <p className="text-base font-semibold text-primer-800">
            Booth card · Job #{card.job.id} · {STAGE_LABELS[card.job.stage]}
          </p>
          <h1 className="text-2xl font-bold tracking-tight text-ink-950 sm:text-3xl">{card.job.title}</h1>
          <p className="text-base text-primer-800">
            {card.job.customerName}
            {card.job.assignedPainterName ? ` · painter ${card.job.assignedPainterName}` : " · no painter assigned"}
            {card.job.dueDate ? ` · due ${formatDate(card.job.dueDate)}` : ""}
          </p>
        </div>
        <nav aria-label="Job links" className="flex flex-wrap gap-2">
          <ButtonLink to={paths.prep} variant="secondary" size="lg" icon={<ClipboardCheck aria-hidden className="size-5" />}>
            Prep records
          </ButtonLink>
          <ButtonLink to={paths.ticket} variant="secondary" size="lg" icon={<Printer aria-hidden className="size-5" />}>
            Job ticket
          </ButtonLink>
          <ButtonLink to={paths.job} variant="ghost" size="lg" icon={<SquareArrowOutUpRight aria-hidden className="size-5" />}>
            Job page
          </ButtonLink>
        </nav>
      </header>

      {card.job.colourWaitsForCustomer ? (
        <Alert tone="warning" title="Colour not approved by the customer yet">
          Shop rule: {COLOUR_SIGN_OFF_RULE.toLowerCase()}. Ground, candy and effect coats wait until the customer approves a test panel in the portal; ask the office.
        </Alert>
      ) : null}
      {card.changesWaiting.length ? (
        <Alert tone="warning" title={CHANGE_WAITING}>
          Change order {card.changesWaiting.map((id) => `#${id}`).join(", ")} has not been approved by the customer. The marked layers wait; only the owner can go ahead, with a reason.
        </Alert>
      ) : null}
      {card.prepOverrides.length ? (
        <Alert tone="warning" title="Sprayed before prep sign-off">
          <ul className="list-disc pl-5">
            {card.prepOverrides.map((o) => (
              <li key={o.coatLogId}>
                {o.byName ?? "Former user"}: {o.reason}
              </li>
            ))}
          </ul>
        </Alert>
      ) : null}

      <TimingOverrides card={card} />

      <div className="grid gap-5 xl:grid-cols-[minmax(0,1.25fr)_minmax(0,1fr)]">
        <div className="flex min-w-0 flex-col gap-5">
          <NextStepPanel card={card} now={now} clockOffset={Date.parse(card.serverNow) - receivedAt} prepPath={paths.prep} />
          {queued}
          <CoatLogList card={card} />
        </div>
        <div className="flex min-w-0 flex-col gap-5">
          <Panel title="Layers" titleId="layers-heading" actions={card.plan ? <span className="text-sm font-medium text-primer-800">{card.plan.name}, version {card.plan.version}{card.plan.frozen ? " (sprayed, fixed)" : ""}</span> : undefined}>
            {card.layers.length ? <LayerList layers={card.layers} prepPath={paths.prep} /> : <p className="text-primer-800">No layers yet.</p>}
          </Panel>
          {card.next.state === "spray" ? <BatchPanel card={card} mixSheetPath={paths.mixSheet} jobPlanPath={paths.jobPlan} /> : null}
          <Panel title="Items and prep" titleId="items-heading">
            <ul className="flex flex-col gap-2">
              {card.items.map((i) => (
                <li key={i.id} className="flex flex-wrap items-center justify-between gap-2">
                  <span className="text-base font-semibold text-ink-950">
                    {i.name} <span className="font-normal text-primer-800">({SUBSTRATE_LABELS[i.substrate]}{i.needsAdhesionPromoter ? ", needs adhesion promoter" : ""})</span>
                  </span>
                  <span
                    className={cn(
                      "rounded-full px-3 py-1 text-sm font-semibold",
                      i.prepStatus === "signed_off" ? "bg-emerald-100 text-emerald-950" : i.prepStatus === "in_progress" ? "bg-flake-100 text-flake-900" : "bg-primer-200 text-ink-950",
                    )}
                  >
                    {PREP_STATUS_LABELS[i.prepStatus]}
                  </span>
                </li>
              ))}
            </ul>
            <Link to={paths.prep} className="mt-3 inline-flex min-h-12 items-center text-base font-semibold text-candy-700 underline underline-offset-2">
              Record prep
            </Link>
          </Panel>
          {card.job.approvedPanel ? (
            <Panel title="Approved colour" titleId="colour-heading">
              <div className="flex items-center gap-4">
                {card.job.approvedPanel.thumbUrl ? <img src={card.job.approvedPanel.thumbUrl} alt={`Approved panel: ${card.job.approvedPanel.label}`} className="size-24 rounded-lg border border-primer-300 object-cover" /> : null}
                <p className="text-base font-semibold text-ink-950">{card.job.approvedPanel.label}</p>
              </div>
            </Panel>
          ) : null}
        </div>
      </div>

      {current && current.cautions.length && !mainCautionsVisible ? (
        // The layer's cautions stay in view: when the full ones in the next-step panel scroll away, this bar shows.
        <div className="sticky bottom-2 z-20 mt-auto" data-testid="sticky-cautions">
          <SafetyCautions cautions={current.cautions} compact className="border-2 border-flake-700 shadow-raised" />
        </div>
      ) : null}
    </div>
  );
}

/** Whether the element matching `selector` is on screen (re-checked when `key` changes). */
function useInView(selector: string, key: unknown) {
  const [visible, setVisible] = useState(true);
  useEffect(() => {
    const el = document.querySelector(selector);
    if (!el || typeof IntersectionObserver === "undefined") {
      setVisible(!!el);
      return;
    }
    // The top margin leaves out the app's sticky top bar (on tablets), which covers content scrolled under it.
    const observer = new IntersectionObserver(([entry]) => setVisible(!!entry?.isIntersecting), { threshold: 0.25, rootMargin: "-120px 0px 0px 0px" });
    observer.observe(el);
    return () => observer.disconnect();
  }, [selector, key]);
  return visible;
}
