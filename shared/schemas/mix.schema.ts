import { z } from "zod";
import { MASS_UNIT_IDS, VOLUME_UNIT_IDS } from "../mix/index";

export const MAX_MIX_COMPONENTS = 12;

const positive = (label: string) =>
  z.coerce.number({ error: `${label} must be a number` }).finite(`${label} must be a number`).positive(`${label} must be more than 0`);

const name = z.string({ error: "Name is required" }).trim().min(1, "Name is required").max(60, "Name is limited to 60 characters");
const density = positive("Density").max(5, "Density above 5 g/mL is not a paint").optional();

/** A component written the painter's way: parts (4:1:1) or a percent of other components (reduce 10 %). */
export const mixComponentSchema = z.union([
  z.object({ name, parts: positive("Parts").max(1000, "Parts are limited to 1000"), densityGPerMl: density }),
  z.object({
    name,
    percent: positive("Percent").max(1000, "Percent is limited to 1000"),
    percentOf: z.union([name, z.array(name).min(1, "Name at least one component")]),
    densityGPerMl: density,
  }),
]);

export const volumeUnitSchema = z.enum(VOLUME_UNIT_IDS, { error: `Unit must be one of: ${VOLUME_UNIT_IDS.join(", ")}` });
export const measuringUnitSchema = z.enum([...VOLUME_UNIT_IDS, ...MASS_UNIT_IDS], { error: "Unknown measuring unit" });

export const mixRequestSchema = z.object({
  components: z.array(mixComponentSchema).min(1, "Add at least one component").max(MAX_MIX_COMPONENTS, `At most ${MAX_MIX_COMPONENTS} components`),
  mode: z.enum(["total", "component"], { error: "mode must be total or component" }),
  amount: positive("Amount").max(1e6, "Amount is too large"),
  unit: volumeUnitSchema,
  knownName: name.optional(),
  rounding: z
    .object({
      step: positive("Step").max(1e4, "Step is too large"),
      unit: measuringUnitSchema,
      tolerancePct: positive("Ratio tolerance").max(20, "Ratio tolerance is limited to 20%").optional(),
      allowUnder: z.boolean({ error: "allowUnder must be true or false" }).optional(),
    })
    .optional(),
});
export type MixRequestInput = z.input<typeof mixRequestSchema>;
