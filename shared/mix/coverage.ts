import { MixError, requireNonNegative, requirePercent, requirePositive } from "./errors";
import { convertVolume, M2_PER_FT2, UM_PER_MIL, requireVolumeUnit, type VolumeUnit } from "./units";

/*
 * Coverage and film thickness.
 *
 * One litre of paint spread 1 µm thick covers 1 L / 1 µm = 0.001 m³ / 1e-6 m = 1000 m². In US units,
 * one gallon (231 in³) spread 1 mil (0.001 in) thick covers 231 / 0.001 / 144 ≈ 1604.1667 ft².
 * Only the solids stay on the part, and only the transferred fraction lands on it, so
 *     spreading rate = constant × (volume solids) × (transfer efficiency) / (dry film thickness).
 * Wet film = dry film / volume solids.
 */

/** m² covered by 1 L at 1 µm (exact). */
export const M2_PER_L_AT_1_UM = 1000;
/** ft² covered by 1 US gallon at 1 mil: 231 in³ / 0.001 in / 144 in²·ft⁻² (exact rational). */
export const FT2_PER_GAL_AT_1_MIL = 231 / 0.001 / 144;

export type FilmUnit = "um" | "mil";
export type AreaUnit = "m2" | "ft2";
export type SpreadingRateUnit = "m2/L" | "ft2/gal";

export interface SpreadingRateInput {
  /** Volume solids of the ready-to-spray material, in % (0–100]. */
  volumeSolidsPct: number;
  dryFilm: number;
  dryFilmUnit: FilmUnit;
  /** Share of the sprayed solids that lands on the part, in %; omit for the theoretical rate. */
  transferEfficiencyPct?: number;
}

function toMicrometres(film: number, unit: FilmUnit, field: string): number {
  requirePositive(film, field);
  if (unit === "um") return film;
  if (unit === "mil") return film * UM_PER_MIL;
  throw new MixError(`${field}Unit: unknown film unit ${JSON.stringify(unit)} (use um or mil)`, {
    field: `${field}Unit`,
  });
}

/** Area covered per volume of ready-to-spray material. */
export function spreadingRate(input: SpreadingRateInput, out: SpreadingRateUnit): number {
  const vs = requirePercent(input.volumeSolidsPct, "volumeSolidsPct") / 100;
  const te =
    input.transferEfficiencyPct === undefined
      ? 1
      : requirePercent(input.transferEfficiencyPct, "transferEfficiencyPct") / 100;
  if (out === "ft2/gal") {
    // Work in mil so the exact US constant is used directly.
    const mil = toMicrometres(input.dryFilm, input.dryFilmUnit, "dryFilm") / UM_PER_MIL;
    return (FT2_PER_GAL_AT_1_MIL * vs * te) / mil;
  }
  if (out === "m2/L") {
    const um = toMicrometres(input.dryFilm, input.dryFilmUnit, "dryFilm");
    return (M2_PER_L_AT_1_UM * vs * te) / um;
  }
  throw new MixError(`out: unknown spreading-rate unit ${JSON.stringify(out)} (use m2/L or ft2/gal)`, {
    field: "out",
  });
}

/** Wet film thickness that dries to `dryFilm` (same unit): WFT = DFT / volume solids. */
export function wetFilmFromDry(dryFilm: number, volumeSolidsPct: number): number {
  requirePositive(dryFilm, "dryFilm");
  return dryFilm / (requirePercent(volumeSolidsPct, "volumeSolidsPct") / 100);
}

/** Dry film left by a wet film (same unit): DFT = WFT × volume solids. */
export function dryFilmFromWet(wetFilm: number, volumeSolidsPct: number): number {
  requirePositive(wetFilm, "wetFilm");
  return wetFilm * (requirePercent(volumeSolidsPct, "volumeSolidsPct") / 100);
}

/**
 * Volume solids of a mix, assuming volumes add: Σ(volume_i × VS_i) / Σ volume_i, in %.
 * A reducer has 0 % solids, so reducing lowers the volume solids of the ready-to-spray mix.
 */
export function mixVolumeSolids(items: readonly { volume: number; volumeSolidsPct: number }[]): number {
  if (!Array.isArray(items) || items.length === 0) {
    throw new MixError("items: nothing to mix", { field: "items" });
  }
  let volume = 0;
  let solids = 0;
  items.forEach((item, i) => {
    const v = requireNonNegative(item.volume, `items[${i}].volume`);
    const vs = requirePercent(item.volumeSolidsPct, `items[${i}].volumeSolidsPct`, { allowZero: true });
    volume += v;
    solids += (v * vs) / 100;
  });
  if (volume <= 0) throw new MixError("items: the total volume must be greater than 0", { field: "items" });
  return (solids / volume) * 100;
}

export interface VolumeNeededInput {
  area: number;
  areaUnit: AreaUnit;
  coats: number;
  dryFilmPerCoat: number;
  dryFilmUnit: FilmUnit;
  /** Volume solids of the ready-to-spray material, in %. */
  volumeSolidsPct: number;
  transferEfficiencyPct: number;
  /** Other losses (left in the cup and gun, spills), in % of the material; default 0. */
  otherLossPct?: number;
}

/**
 * Ready-to-spray volume needed for one job item:
 *   V = area × coats × DFT / (1000 m²/(L·µm) × VS × TE × (1 − other losses)).
 * `coats` may be fractional (e.g. an equivalent candy coat count).
 */
export function volumeNeeded(input: VolumeNeededInput, unit: VolumeUnit): number {
  const area = requirePositive(input.area, "area");
  let areaM2: number;
  if (input.areaUnit === "m2") areaM2 = area;
  else if (input.areaUnit === "ft2") areaM2 = area * M2_PER_FT2;
  else {
    throw new MixError(`areaUnit: unknown area unit ${JSON.stringify(input.areaUnit)} (use m2 or ft2)`, {
      field: "areaUnit",
    });
  }
  const coats = requirePositive(input.coats, "coats");
  const um = toMicrometres(input.dryFilmPerCoat, input.dryFilmUnit, "dryFilmPerCoat");
  const vs = requirePercent(input.volumeSolidsPct, "volumeSolidsPct") / 100;
  const te = requirePercent(input.transferEfficiencyPct, "transferEfficiencyPct") / 100;
  const loss = requireNonNegative(input.otherLossPct ?? 0, "otherLossPct");
  if (loss >= 100) {
    throw new MixError(`otherLossPct: must be below 100 (got ${loss})`, { field: "otherLossPct" });
  }
  const u = requireVolumeUnit(unit);
  const litres = (areaM2 * coats * um) / (M2_PER_L_AT_1_UM * vs * te * (1 - loss / 100));
  return convertVolume(litres, "L", u);
}
