import { MixError, requireNonNegative } from "./errors";

/*
 * US customary volume and avoirdupois mass units, from their exact definitions:
 *   1 in = 2.54 cm exactly, so 1 in³ = 16.387064 mL; 1 US gallon = 231 in³ = 3785.411784 mL;
 *   fluid ounce = gallon/128, cup = 8 fl oz, pint = 16 fl oz, quart = 32 fl oz;
 *   1 lb = 453.59237 g exactly (1959 international pound), 1 oz = lb/16.
 *
 * Each unit is stored as a whole number of a tiny base unit (1e-10 mL, 1e-9 g) so every factor is
 * an exact integer well below 2^53; a conversion is then one exact division of two integers and
 * one multiplication, i.e. at most two rounding steps in double precision.
 */

export const VOLUME_UNIT_IDS = ["mL", "L", "floz", "cup", "pint", "quart", "gallon"] as const;
export type VolumeUnit = (typeof VOLUME_UNIT_IDS)[number];

export const MASS_UNIT_IDS = ["g", "kg", "oz", "lb"] as const;
export type MassUnit = (typeof MASS_UNIT_IDS)[number];

/** Volume of one unit in units of 1e-10 mL (all exact integers below 2^53). */
const VOLUME_BASE: Record<VolumeUnit, number> = {
  mL: 10_000_000_000,
  L: 10_000_000_000_000,
  floz: 295_735_295_625, // 29.5735295625 mL = 3785.411784 mL / 128
  cup: 2_365_882_365_000, // 8 fl oz
  pint: 4_731_764_730_000, // 16 fl oz
  quart: 9_463_529_460_000, // 32 fl oz
  gallon: 37_854_117_840_000, // 231 in³ × 16.387064 mL/in³
};

/** Mass of one unit in units of 1e-9 g (all exact integers). */
const MASS_BASE: Record<MassUnit, number> = {
  g: 1_000_000_000,
  kg: 1_000_000_000_000,
  oz: 28_349_523_125, // 28.349523125 g = lb / 16
  lb: 453_592_370_000, // 453.59237 g
};

/** Millilitres in one US gallon (231 in³ exactly). */
export const ML_PER_GALLON = 3785.411784;
/** Grams in one avoirdupois pound (exact). */
export const G_PER_LB = 453.59237;
/** Micrometres in one mil (0.001 in = 25.4 µm exactly). */
export const UM_PER_MIL = 25.4;
/** Square metres in one square foot (0.3048 m squared, exact). */
export const M2_PER_FT2 = 0.09290304;

export interface UnitOption<U extends string> {
  value: U;
  /** Short symbol for tables and inputs. */
  symbol: string;
  /** Full name for dropdowns. */
  label: string;
}

/** Volume units for dropdowns: metric first, then US customary from small to large. */
export const VOLUME_UNITS: readonly UnitOption<VolumeUnit>[] = [
  { value: "mL", symbol: "mL", label: "millilitre (mL)" },
  { value: "L", symbol: "L", label: "litre (L)" },
  { value: "floz", symbol: "fl oz", label: "US fluid ounce (fl oz)" },
  { value: "cup", symbol: "cup", label: "US cup (8 fl oz)" },
  { value: "pint", symbol: "pt", label: "US pint (16 fl oz)" },
  { value: "quart", symbol: "qt", label: "US quart (32 fl oz)" },
  { value: "gallon", symbol: "gal", label: "US gallon (128 fl oz)" },
];

/** Mass units for dropdowns. */
export const MASS_UNITS: readonly UnitOption<MassUnit>[] = [
  { value: "g", symbol: "g", label: "gram (g)" },
  { value: "kg", symbol: "kg", label: "kilogram (kg)" },
  { value: "oz", symbol: "oz", label: "ounce, avoirdupois (oz)" },
  { value: "lb", symbol: "lb", label: "pound, avoirdupois (lb)" },
];

export function isVolumeUnit(unit: unknown): unit is VolumeUnit {
  return typeof unit === "string" && Object.hasOwn(VOLUME_BASE, unit);
}

export function isMassUnit(unit: unknown): unit is MassUnit {
  return typeof unit === "string" && Object.hasOwn(MASS_BASE, unit);
}

export function requireVolumeUnit(unit: unknown, field = "unit"): VolumeUnit {
  if (!isVolumeUnit(unit)) {
    throw new MixError(
      `${field}: unknown volume unit ${JSON.stringify(unit)} (use one of ${VOLUME_UNIT_IDS.join(", ")})`,
      { field },
    );
  }
  return unit;
}

export function requireMassUnit(unit: unknown, field = "unit"): MassUnit {
  if (!isMassUnit(unit)) {
    throw new MixError(
      `${field}: unknown mass unit ${JSON.stringify(unit)} (use one of ${MASS_UNIT_IDS.join(", ")})`,
      { field },
    );
  }
  return unit;
}

/** Converts a volume (0 or more) between two volume units. */
export function convertVolume(value: number, from: VolumeUnit, to: VolumeUnit): number {
  requireNonNegative(value, "value");
  const f = requireVolumeUnit(from, "from");
  const t = requireVolumeUnit(to, "to");
  return f === t ? value : value * (VOLUME_BASE[f] / VOLUME_BASE[t]);
}

/** Converts a mass (0 or more) between two mass units. */
export function convertMass(value: number, from: MassUnit, to: MassUnit): number {
  requireNonNegative(value, "value");
  const f = requireMassUnit(from, "from");
  const t = requireMassUnit(to, "to");
  return f === t ? value : value * (MASS_BASE[f] / MASS_BASE[t]);
}
