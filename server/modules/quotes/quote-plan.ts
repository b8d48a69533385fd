import type { AppDeps } from "../../deps";
import { estimateJobPlan } from "../plans/plan-estimate.service";
import { loadPlanVersion } from "../plans/plans.service";
import { describeFinish, type QuoteLine } from "../../../shared/quote/index";

export type PlanForQuote = {
  /** The finish in plain words, from the plan's layers. */
  finishText: string;
  /** One materials line per layer the estimate could cost, at the shop's markup. */
  lines: QuoteLine[];
  /** Layers the estimate could not cost, with why (shown to the estimator, never to the customer). */
  problems: string[];
};

/** "about 320 mL" / "about 1.25 L": the estimate is a planning figure, not a measured one. */
function aboutVolume(ml: number): string {
  if (ml >= 1000) return `about ${(Math.round(ml / 10) / 100).toString()} L`;
  return `about ${Math.max(1, Math.round(ml))} mL`;
}

/**
 * What a quote takes from the job's finish plan (latest version): the materials lines from the plan's estimate
 * and the finish described in plain words. Null when the job has no plan yet.
 */
export function planForQuote(deps: Pick<AppDeps, "db">, jobId: number, markupPercent: number): PlanForQuote | null {
  const estimate = estimateJobPlan(deps, jobId);
  if (!estimate) return null;
  const version = loadPlanVersion(deps, estimate.versionId);
  const finishText = describeFinish(version.layers.map((l) => ({ name: l.name, kind: l.kind, coats: l.coats })));
  const lines: QuoteLine[] = estimate.layers
    .filter((l) => l.costCents > 0)
    .map((l) => ({
      kind: "materials",
      description: `${l.name}: materials, ${aboutVolume(l.volumeMl)} ready to spray`,
      costCents: l.costCents,
      markupPercent,
      layerId: l.layerId,
    }));
  return { finishText, lines, problems: estimate.problems };
}
