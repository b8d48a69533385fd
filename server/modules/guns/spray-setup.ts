import { describeSetup, type SpraySetup } from "../../../shared/domain/spray-setup";
import type { SpraySetupDto } from "../../../shared/schemas/spray-setup.schema";

/** A stored row's spray set-up (coat log or panel) as the API sends it, with the gun named. */
export function setupOf(row: SpraySetup, gunNames: Map<number, string>): SpraySetupDto {
  const setup: SpraySetup = {
    gunId: row.gunId,
    tipMm: row.tipMm,
    inletPressure: row.inletPressure,
    pressureUnit: row.pressureUnit,
    distance: row.distance,
    fanWidth: row.fanWidth,
    distanceUnit: row.distanceUnit,
    overlapPct: row.overlapPct,
  };
  const gunName = row.gunId != null ? (gunNames.get(row.gunId) ?? null) : null;
  return { ...setup, gunName, summary: describeSetup(setup, gunName) };
}

type SetupFields = { [K in keyof SpraySetup]?: SpraySetup[K] | undefined };

/** The set-up columns to store from an input (a figure without its unit keeps no unit). */
export function setupColumns(input: SetupFields): SpraySetup {
  const inletPressure = input.inletPressure ?? null;
  const distance = input.distance ?? null;
  const fanWidth = input.fanWidth ?? null;
  return {
    gunId: input.gunId ?? null,
    tipMm: input.tipMm ?? null,
    inletPressure,
    pressureUnit: inletPressure != null ? (input.pressureUnit ?? null) : null,
    distance,
    fanWidth,
    distanceUnit: distance != null || fanWidth != null ? (input.distanceUnit ?? null) : null,
    overlapPct: input.overlapPct ?? null,
  };
}
