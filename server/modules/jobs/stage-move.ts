import { eq } from "drizzle-orm";
import type { Tx } from "../../db/client";
import { jobStageEvents, jobs } from "../../db/schema";
import type { Stage } from "../../../shared/domain/stages";

export type StageMove = {
  jobId: number;
  from: Stage;
  to: Stage;
  /** Who moved it; null when no account did (a payment by a customer without one, or the system). */
  userId: string | null;
  /** How: by a person (default), by a payment arriving, or by Coatwright itself. */
  via?: "user" | "payment" | "system";
  note: string | null;
  at: number;
};

/** Moves a job to another stage and writes the move on its timeline, inside the caller's transaction. */
export function recordStageMove(tx: Tx, move: StageMove) {
  tx.update(jobs).set({ stage: move.to, stageChangedAt: move.at, updatedAt: move.at }).where(eq(jobs.id, move.jobId)).run();
  tx.insert(jobStageEvents)
    .values({ jobId: move.jobId, fromStage: move.from, toStage: move.to, userId: move.userId, via: move.via ?? "user", note: move.note, at: move.at })
    .run();
}
