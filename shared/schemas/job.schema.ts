import { z } from "zod";
import { STAGES, type Stage } from "../domain/stages";
import { idSchema, isoDateSchema, optionalText, requiredText, versionSchema } from "./common.schema";
import { pageQuerySchema, sortSchema } from "../api/pagination";

export const stageSchema = z.enum(STAGES, { error: `Stage must be one of: ${STAGES.join(", ")}` });

export const createJobInputSchema = z.object({
  customerId: idSchema,
  title: requiredText(160, "Title"),
  dueDate: isoDateSchema.nullable().optional(),
  assignedPainterId: z.string().min(1).max(64).nullable().optional(),
  notes: optionalText(4000, "Notes"),
});
export type CreateJobInput = z.input<typeof createJobInputSchema>;

export const updateJobInputSchema = createJobInputSchema.partial().extend({ version: versionSchema });
export type UpdateJobInput = z.input<typeof updateJobInputSchema>;

export const changeStageInputSchema = z.object({
  stage: stageSchema,
  note: optionalText(500, "Note"),
});
export type ChangeStageInput = z.input<typeof changeStageInputSchema>;

/** Comma-separated stages are accepted: ?stage=in_prep,in_booth */
const stageFilterSchema = z
  .union([z.string(), z.array(z.string())])
  .transform((v) => (Array.isArray(v) ? v : v.split(",")).map((s) => s.trim()).filter(Boolean))
  .pipe(z.array(stageSchema));

export const JOB_SORT_FIELDS = ["id", "title", "customer", "stage", "dueDate", "updatedAt", "createdAt"] as const;
export type JobSortField = (typeof JOB_SORT_FIELDS)[number];

export const listJobsQuerySchema = pageQuerySchema.extend({
  stage: stageFilterSchema.optional(),
  customerId: idSchema.optional(),
  painterId: z.string().max(64).optional(),
  due: z.enum(["overdue", "week"], { error: "due must be overdue or week" }).optional(),
  sort: sortSchema(JOB_SORT_FIELDS, "dueDate"),
});
export type ListJobsQuery = z.infer<typeof listJobsQuerySchema>;

export type JobItemDto = {
  /** The edit version: goes up with every change; an edit sends the one it read. */
  version: number;
  id: number;
  jobId: number;
  name: string;
  substrate: string;
  surfaceArea: number;
  areaUnit: "m2" | "ft2";
  notes: string | null;
  createdAt: string;
  updatedAt: string;
};

export type StageEventDto = {
  id: number;
  fromStage: Stage | null;
  toStage: Stage;
  note: string | null;
  byName: string;
  at: string;
};

/** A job as the staff see it. Customers get the same shape without `notes` (internal). */
export type JobDto = {
  /** The edit version: goes up with every change; an edit sends the one it read. */
  version: number;
  id: number;
  title: string;
  stage: Stage;
  dueDate: string | null;
  customerId: number;
  customerName: string;
  assignedPainterId: string | null;
  assignedPainterName: string | null;
  notes?: string | null;
  itemCount: number;
  createdAt: string;
  updatedAt: string;
  stageChangedAt: string;
  /** On the board: the job's next session on the booth schedule, if one is booked. */
  nextBoothSlot?: { startsAt: string; boothName: string } | null;
};

export type JobDetailDto = JobDto & {
  items: JobItemDto[];
  events: StageEventDto[];
  nextStages: Stage[];
};

export type BoardColumnDto = { stage: Stage; total: number; jobs: JobDto[] };
export type BoardDto = { columns: BoardColumnDto[] };
