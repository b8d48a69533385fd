import { UM_PER_MIL, type MassUnit, type VolumeUnit } from "../mix/index";
import type { AreaUnit } from "./substrates";
import type { TempUnit } from "./booth";

/** The measures a shop chooses units for, and the units each may be shown in. */
export const FILM_UNITS = ["um", "mil"] as const;
export type FilmUnit = (typeof FILM_UNITS)[number];
export const PRESSURE_UNITS = ["psi", "bar"] as const;
export type PressureUnit = (typeof PRESSURE_UNITS)[number];
export const SCALE_UNITS = ["g", "oz"] as const satisfies readonly MassUnit[];
export type ScaleUnit = (typeof SCALE_UNITS)[number];
export const UNIT_SYSTEMS = ["metric", "us"] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

export type ShopUnits = {
  volume: VolumeUnit;
  area: AreaUnit;
  film: FilmUnit;
  pressure: PressureUnit;
  temperature: TempUnit;
  mass: ScaleUnit;
};

/** What each system shows for every measure; the shop may then override any one of them. */
export const UNIT_PRESETS: Record<UnitSystem, ShopUnits> = {
  metric: { volume: "mL", area: "m2", film: "um", pressure: "bar", temperature: "C", mass: "g" },
  us: { volume: "floz", area: "ft2", film: "mil", pressure: "psi", temperature: "F", mass: "oz" },
};

/** 1 psi = 6.894757293168 kPa = 0.06894757293168 bar (NIST SP 811, App. B.8). */
export const BAR_PER_PSI = 0.06894757293168;

export function convertPressure(value: number, from: PressureUnit, to: PressureUnit): number {
  if (from === to) return value;
  return to === "bar" ? value * BAR_PER_PSI : value / BAR_PER_PSI;
}

/** 1 mil = 0.001 in = 25.4 µm (exact, from the international inch). */
export function convertFilm(value: number, from: FilmUnit, to: FilmUnit): number {
  if (from === to) return value;
  return to === "um" ? value * UM_PER_MIL : value / UM_PER_MIL;
}

export const FILM_UNIT_LABELS: Record<FilmUnit, string> = { um: "µm", mil: "mil" };
export const PRESSURE_UNIT_LABELS: Record<PressureUnit, string> = { psi: "psi", bar: "bar" };
