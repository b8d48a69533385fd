import { z } from "zod";
import { SOLVENT_PURPOSES, type MaterialCategory, type SolventPurpose } from "../domain/materials";
import { idSchema, isoDateSchema, optionalText } from "./common.schema";
import { volumeUnitSchema } from "./mix.schema";
import { requiredNumber } from "./material.schema";

/** Prep or cleaning solvent used outside a batch (wax and grease remover on the parts, gun wash): counted in the VOC log. */
export const createSolventUseInputSchema = z.object({
  materialId: idSchema,
  /** The job it was used on, when there is one (gun cleaning often has none). */
  jobId: idSchema.nullable().optional(),
  purpose: z.enum(SOLVENT_PURPOSES, { error: `Purpose must be one of: ${SOLVENT_PURPOSES.join(", ")}` }),
  amount: requiredNumber("Amount", { min: 0, max: 100_000, gt: true }),
  unit: volumeUnitSchema,
  note: optionalText(300, "Note"),
});
export type CreateSolventUseInput = z.input<typeof createSolventUseInputSchema>;

export const listSolventUsesQuerySchema = z
  .object({ from: isoDateSchema, to: isoDateSchema })
  .refine((q) => q.from <= q.to, { path: ["to"], message: "The end date must not be before the start date" });

export type SolventUseDto = {
  id: number;
  materialId: number;
  materialCode: string;
  materialName: string;
  category: MaterialCategory;
  jobId: number | null;
  jobTitle: string | null;
  purpose: SolventPurpose;
  amount: number;
  unit: string;
  volumeMl: number;
  /** As copied from the catalogue when logged (g/L less water and exempt); null when the material has none. */
  vocGPerL: number | null;
  /** VOC mass of this use, kg. */
  vocKg: number;
  note: string | null;
  usedAt: string;
  loggedByName: string | null;
};
