import { z } from "zod";
import { AREA_UNITS, SUBSTRATES } from "../domain/substrates";
import { idSchema, optionalText, requiredText, versionSchema } from "./common.schema";

export const MAX_ITEM_AREA = 1000;

export const jobItemFieldsSchema = z.object({
  name: requiredText(120, "Name"),
  substrate: z.enum(SUBSTRATES, { error: `Substrate must be one of: ${SUBSTRATES.join(", ")}` }),
  surfaceArea: z.coerce
    .number({ error: "Surface area must be a number" })
    .positive("Surface area must be more than 0")
    .max(MAX_ITEM_AREA, `Surface area is limited to ${MAX_ITEM_AREA}`),
  areaUnit: z.enum(AREA_UNITS, { error: "Area unit must be m2 or ft2" }),
  notes: optionalText(2000, "Notes"),
});

export const createJobItemInputSchema = jobItemFieldsSchema;
export type CreateJobItemInput = z.input<typeof createJobItemInputSchema>;

export const updateJobItemInputSchema = jobItemFieldsSchema.partial().extend({ version: versionSchema });
export type UpdateJobItemInput = z.input<typeof updateJobItemInputSchema>;

export const jobItemParamsSchema = z.object({ id: idSchema, itemId: idSchema });
