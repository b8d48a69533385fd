import { convertVolume, VOLUME_UNITS, MASS_UNITS, type MeasuringUnit, type VolumeUnit } from "@shared/mix/index";
import { PURCHASE_UNIT_SYMBOLS } from "@shared/domain/material-units";
import type { PurchaseUnit } from "@shared/domain/materials";

/** A number for people: at most `digits` decimals, no trailing zeros, grouped thousands. */
export function formatNumber(value: number, digits = 2): string {
  return new Intl.NumberFormat(undefined, { maximumFractionDigits: digits }).format(value);
}

const SYMBOLS: Record<string, string> = Object.fromEntries([...VOLUME_UNITS, ...MASS_UNITS].map((u) => [u.value, u.symbol]));

/** Short symbol of any unit the app uses ("fl oz", "qt", "g"). */
export function unitSymbol(unit: MeasuringUnit | PurchaseUnit | string): string {
  return SYMBOLS[unit] ?? PURCHASE_UNIT_SYMBOLS[unit as PurchaseUnit] ?? unit;
}

/** Digits that suit a unit: whole millilitres and grams, finer steps for big US units. */
export function digitsFor(unit: string): number {
  return unit === "mL" || unit === "g" ? 1 : unit === "gallon" || unit === "L" || unit === "kg" || unit === "lb" ? 3 : 2;
}

/** "12.5 fl oz" */
export function formatAmount(value: number, unit: string, digits = digitsFor(unit)): string {
  return `${formatNumber(value, digits)} ${unitSymbol(unit)}`;
}

/** A volume in mL shown in another unit: formatVolume(363.04, "floz") → "12.28 fl oz". */
export function formatVolume(ml: number, unit: VolumeUnit = "mL"): string {
  return formatAmount(convertVolume(ml, "mL", unit), unit);
}
