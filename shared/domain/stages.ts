import type { Role } from "./roles";

export const STAGES = [
  "inquiry",
  "quoted",
  "booked",
  "in_prep",
  "in_booth",
  "curing",
  "finishing",
  "ready",
  "delivered",
  "cancelled",
] as const;
export type Stage = (typeof STAGES)[number];

export const STAGE_LABELS: Record<Stage, string> = {
  inquiry: "Inquiry",
  quoted: "Quoted",
  booked: "Booked",
  in_prep: "In prep",
  in_booth: "In booth",
  curing: "Curing",
  finishing: "Finishing",
  ready: "Ready",
  delivered: "Delivered",
  cancelled: "Cancelled",
};

/** One line on what each stage means, shown as help on the board. */
export const STAGE_HINTS: Record<Stage, string> = {
  inquiry: "Customer asked; nothing quoted yet",
  quoted: "Quote sent, waiting on the customer",
  booked: "Deposit in; materials can be ordered",
  in_prep: "Stripping, sanding, cleaning, masking",
  in_booth: "Being sprayed",
  curing: "Last coat down; curing",
  finishing: "Wet sanding, buffing, reassembly",
  ready: "Ready for the customer to collect",
  delivered: "Collected and paid",
  cancelled: "Will not go ahead",
};

/** Stages where work happens at the shop; painters may move their own jobs between these. */
export const PRODUCTION_STAGES: readonly Stage[] = ["booked", "in_prep", "in_booth", "curing", "finishing", "ready"];

/** Allowed moves. Forward along the job's life, one step back for rework, cancel before work starts, reopen a cancelled inquiry. */
export const STAGE_MOVES: Record<Stage, readonly Stage[]> = {
  inquiry: ["quoted", "booked", "cancelled"],
  quoted: ["inquiry", "booked", "cancelled"],
  booked: ["quoted", "in_prep", "cancelled"],
  in_prep: ["booked", "in_booth", "cancelled"],
  in_booth: ["in_prep", "curing"],
  curing: ["in_booth", "finishing"],
  finishing: ["in_booth", "curing", "ready"],
  ready: ["finishing", "delivered"],
  delivered: ["ready"],
  cancelled: ["inquiry"],
};

/** The stages a role may move a job to from `from`. Painters only move jobs within production. */
export function nextStagesFor(role: Role, from: Stage): Stage[] {
  const moves = [...STAGE_MOVES[from]];
  if (role === "owner" || role === "estimator") return moves;
  if (role === "painter") {
    if (!PRODUCTION_STAGES.includes(from)) return [];
    return moves.filter((to) => PRODUCTION_STAGES.includes(to) && to !== "booked");
  }
  return [];
}

/** Stages where a job's life is over: collected, or not going ahead. */
export const CLOSED_STAGES: readonly Stage[] = ["delivered", "cancelled"];
export const isClosedStage = (stage: Stage) => CLOSED_STAGES.includes(stage);

/** Stages that count as open work: the board's open columns, the jobs table's default filter, the portal's current jobs. */
export const OPEN_STAGES: readonly Stage[] = STAGES.filter((s) => !isClosedStage(s));

/** Open stages where a due date still means work to do (a ready job waits for its customer): the overdue and this-week lists. */
export const DUE_STAGES: readonly Stage[] = OPEN_STAGES.filter((s) => s !== "ready");
