import { convertMass, convertVolume, isMassUnit, MixError } from "../mix/index";
import type { PurchaseUnit } from "./materials";

/*
 * A material is bought and stocked in its purchase unit: a volume unit of the mix engine (mL … gallon)
 * or a mass unit (g, kg, oz, lb) for things sold by weight. Mixes are worked in volume, so going between
 * the two needs the material's density (g/mL).
 */

/** How much of the purchase unit `ml` millilitres of the material is. Mass units need a density. */
export function mlToPurchaseUnit(ml: number, unit: PurchaseUnit, densityGPerMl: number | null | undefined, name = "material"): number {
  if (isMassUnit(unit)) {
    if (!densityGPerMl || densityGPerMl <= 0) {
      throw new MixError(`${name}: is stocked by weight (${unit}) but has no density, so a volume cannot be taken from stock`, {
        component: name,
        field: "densityGPerMl",
      });
    }
    return convertMass(ml * densityGPerMl, "g", unit);
  }
  return convertVolume(ml, "mL", unit);
}

/** Millilitres in `qty` of the purchase unit (mass units need a density). */
export function purchaseUnitToMl(qty: number, unit: PurchaseUnit, densityGPerMl: number | null | undefined, name = "material"): number {
  if (isMassUnit(unit)) {
    if (!densityGPerMl || densityGPerMl <= 0) {
      throw new MixError(`${name}: is sold by weight (${unit}) but has no density`, { component: name, field: "densityGPerMl" });
    }
    return convertMass(qty, unit, "g") / densityGPerMl;
  }
  return convertVolume(qty, unit, "mL");
}

/** Cost of one millilitre, in (fractional) cents; null when it cannot be worked out (mass unit without density). */
export function centsPerMl(costCents: number, unit: PurchaseUnit, densityGPerMl: number | null | undefined): number | null {
  if (isMassUnit(unit) && (!densityGPerMl || densityGPerMl <= 0)) return null;
  return costCents / purchaseUnitToMl(1, unit, densityGPerMl);
}

/** Short symbol of a purchase unit for tables ("qt", "fl oz", "kg"). */
export const PURCHASE_UNIT_SYMBOLS: Record<PurchaseUnit, string> = {
  mL: "mL",
  L: "L",
  floz: "fl oz",
  pint: "pt",
  quart: "qt",
  gallon: "gal",
  g: "g",
  kg: "kg",
  oz: "oz",
  lb: "lb",
};

/** Purchase units in words, for forms and facts ("US quart (qt)"). */
export const PURCHASE_UNIT_NAMES: Record<PurchaseUnit, string> = {
  mL: "millilitre (mL)",
  L: "litre (L)",
  floz: "US fluid ounce (fl oz)",
  pint: "US pint (pt)",
  quart: "US quart (qt)",
  gallon: "US gallon (gal)",
  g: "gram (g)",
  kg: "kilogram (kg)",
  oz: "ounce, by weight (oz)",
  lb: "pound (lb)",
};
