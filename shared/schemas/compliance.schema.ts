import { z } from "zod";
import { isoDateSchema } from "./common.schema";
import type { LayerKind } from "../domain/layers";
import type { MaterialCategory } from "../domain/materials";
import type { SolventUseDto } from "./solvent-use.schema";

export const complianceQuerySchema = z
  .object({ from: isoDateSchema, to: isoDateSchema })
  .refine((q) => q.from <= q.to, { path: ["to"], message: "The end date must not be before the start date" });
export type ComplianceQuery = z.infer<typeof complianceQuerySchema>;

export type VocAmount = { gPerL: number; lbPerGal: number };
export type VocMass = { kg: number; lb: number };

export type ComplianceBatchDto = {
  id: number;
  mixedAt: string;
  jobId: number;
  jobTitle: string;
  layerName: string;
  layerKind: LayerKind;
  volumeL: number;
  volumeGal: number;
  voc: VocAmount | null;
  vocMass: VocMass;
  limitGPerL: number | null;
  overLimit: boolean;
};

export type ComplianceMonthDto = {
  month: string;
  batches: number;
  /** Prep and cleaning solvent logged outside a batch (counted in the month's volume and VOC). */
  solventUses: number;
  volumeL: number;
  volumeGal: number;
  vocMass: VocMass;
  capKg: number | null;
  overCap: boolean;
  batchesOverLimit: number;
};

export type ComplianceCategoryDto = { category: MaterialCategory; volumeL: number; volumeGal: number; vocMass: VocMass };

export type ComplianceDto = {
  from: string;
  to: string;
  batches: ComplianceBatchDto[];
  months: ComplianceMonthDto[];
  categories: ComplianceCategoryDto[];
  /** Prep and cleaning solvent logged outside a batch, counted in the months, categories and totals. */
  solventUses: SolventUseDto[];
  totals: { batches: number; solventUses: number; volumeL: number; volumeGal: number; vocMass: VocMass; batchesOverLimit: number };
  limits: { layerKind: LayerKind; limitGPerL: number; limitLbPerGal: number }[];
  yearlyCapKg: number | null;
  monthlyCapKg: number | null;
  /** For the year of `to`: VOC mass so far vs the yearly cap. */
  yearToDate: { year: string; vocMass: VocMass; overCap: boolean } | null;
};
