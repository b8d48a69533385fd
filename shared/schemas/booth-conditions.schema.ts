import type { z } from "zod";
import type { TempUnit } from "../domain/temperature";

/** Booth air temperature limits by unit (a booth outside these is not one anyone sprays in). */
export const TEMP_LIMITS: Record<TempUnit, { min: number; max: number }> = { C: { min: -10, max: 60 }, F: { min: 14, max: 140 } };

/** A temperature needs its unit and stays within the booth limits for that unit. */
export function checkTemp(v: { boothTemp?: number | null; tempUnit?: TempUnit | null }, ctx: z.RefinementCtx) {
  if (v.boothTemp == null) return;
  if (!v.tempUnit) {
    ctx.addIssue({ code: "custom", path: ["tempUnit"], message: "Say whether the temperature is °C or °F" });
    return;
  }
  const { min, max } = TEMP_LIMITS[v.tempUnit];
  if (v.boothTemp < min || v.boothTemp > max)
    ctx.addIssue({ code: "custom", path: ["boothTemp"], message: `Booth temperature in °${v.tempUnit} must be between ${min} and ${max}` });
}
