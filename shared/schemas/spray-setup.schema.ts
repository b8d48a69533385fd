import { z } from "zod";
import { LENGTH_UNITS, PRESSURE_UNITS, SETUP_LIMITS, type SpraySetup } from "../domain/spray-setup";
import { idSchema, optionalText, requiredText, versionSchema } from "./common.schema";
import { optionalNumber } from "./prep.schema";

/** The spray set-up fields, for spreading into a coat log's or a panel's input schema (then add `checkSetup`). */
export const spraySetupFields = {
  gunId: z.preprocess((v) => (v === "" ? null : v), idSchema.nullable()).optional(),
  tipMm: optionalNumber("Tip size", SETUP_LIMITS.tipMm.min, SETUP_LIMITS.tipMm.max),
  inletPressure: optionalNumber("Inlet pressure", 0, 100),
  pressureUnit: z.preprocess((v) => (v === "" ? null : v), z.enum(PRESSURE_UNITS, { error: "Pressure unit must be psi or bar" }).nullable()).optional(),
  distance: optionalNumber("Gun distance", 0, 60),
  fanWidth: optionalNumber("Fan width", 0, 60),
  distanceUnit: z.preprocess((v) => (v === "" ? null : v), z.enum(LENGTH_UNITS, { error: "Length unit must be cm or in" }).nullable()).optional(),
  overlapPct: optionalNumber("Overlap", 0, 100),
};

type SetupInput = { inletPressure?: number | null; pressureUnit?: string | null; distance?: number | null; fanWidth?: number | null; distanceUnit?: string | null };

/** A figure needs its unit, and stays within what that unit allows. */
export function checkSetup(v: SetupInput, ctx: z.RefinementCtx) {
  if (v.inletPressure != null) {
    if (!v.pressureUnit) ctx.addIssue({ code: "custom", path: ["pressureUnit"], message: "Say whether the pressure is psi or bar" });
    else {
      const { min, max } = SETUP_LIMITS.pressure[v.pressureUnit as "psi" | "bar"];
      if (v.inletPressure < min || v.inletPressure > max) ctx.addIssue({ code: "custom", path: ["inletPressure"], message: `Inlet pressure in ${v.pressureUnit} must be between ${min} and ${max}` });
    }
  }
  for (const key of ["distance", "fanWidth"] as const) {
    const value = v[key];
    if (value == null) continue;
    const label = key === "distance" ? "Gun distance" : "Fan width";
    if (!v.distanceUnit) {
      ctx.addIssue({ code: "custom", path: ["distanceUnit"], message: "Say whether lengths are in cm or in" });
      continue;
    }
    const { min, max } = SETUP_LIMITS[key][v.distanceUnit as "cm" | "in"];
    if (value < min || value > max) ctx.addIssue({ code: "custom", path: [key], message: `${label} in ${v.distanceUnit} must be between ${min} and ${max}` });
  }
}

export type SpraySetupDto = SpraySetup & { gunName: string | null; summary: string };

/** A spray gun of the shop's own list (named as the shop knows it, e.g. "Gun 2 (candy)"). */
export const gunInputSchema = z.object({
  name: requiredText(80, "Name"),
  /** Kind and usual set-up in the shop's words: "HVLP, 1.3 mm tip for candy". */
  description: optionalText(300, "Description"),
  active: z.boolean({ error: "active must be true or false" }).optional(),
});
export type GunInput = z.input<typeof gunInputSchema>;
export const updateGunInputSchema = gunInputSchema.partial().extend({ version: versionSchema });

export type GunDto = { id: number; name: string; description: string | null; active: boolean; version: number };
