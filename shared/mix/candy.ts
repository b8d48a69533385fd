import { MixError, requirePositive } from "./errors";
import { resolveShares, type MixComponent } from "./mix";

/*
 * Candy (transparent) coats and the Beer–Lambert law.
 *
 * Absorbance is proportional to dye concentration × path length (A = ε·c·ℓ). If every coat lays down
 * the same wet film of ready-to-spray material, the dye per unit area in one coat is proportional to
 * the toner's volume fraction f in that material, and n coats stack: A_total ∝ f × n. So the same
 * colour depth at a new let-down needs
 *     n₂ = n₁ × f₁ / f₂,   f = toner / (clear + toner).
 * (Not n₁ × (toner/clear)₁ / (toner/clear)₂: that ignores the toner's own volume.)
 * Assumes dilute dye and no scattering; flake or pearl layers break the model.
 */

/** A candy let-down: parts of clear to parts of toner, e.g. 6:1 → { clear: 6, toner: 1 }. */
export interface LetDown {
  clear: number;
  toner: number;
}

/** Toner volume fraction of a let-down: toner / (clear + toner). */
export function tonerFraction(letDown: LetDown, field = "letDown"): number {
  const clear = requirePositive(letDown?.clear, `${field}.clear`);
  const toner = requirePositive(letDown?.toner, `${field}.toner`);
  return toner / (clear + toner);
}

/** Coats at a new toner fraction that give the same toner per unit area: n₂ = n₁ × f₁ / f₂. */
export function equivalentCoatsByFraction(coats: number, fromFraction: number, toFraction: number): number {
  requirePositive(coats, "coats");
  const f1 = requirePositive(fromFraction, "fromFraction");
  const f2 = requirePositive(toFraction, "toFraction");
  if (f1 > 1 || f2 > 1) {
    throw new MixError("fromFraction/toFraction: a toner fraction cannot exceed 1", { field: "toFraction" });
  }
  return (coats * f1) / f2;
}

/** Coats at the `to` let-down that match the colour depth of `coats` at the `from` let-down. */
export function equivalentCoats(coats: number, from: LetDown, to: LetDown): number {
  return equivalentCoatsByFraction(coats, tonerFraction(from, "from"), tonerFraction(to, "to"));
}

/**
 * Toner fraction of a complete ready-to-spray recipe (toner, clear, hardener, reducer…): the summed
 * share of the named toner components. Use this rather than the let-down alone when the clear is
 * activated or reduced after the toner goes in.
 */
export function tonerFractionOfMix(components: readonly MixComponent[], tonerNames: string | readonly string[]): number {
  const names = [...new Set(typeof tonerNames === "string" ? [tonerNames] : tonerNames)];
  const shares = resolveShares(components);
  if (names.length === 0) throw new MixError("tonerNames: name at least one toner component", { field: "tonerNames" });
  return names.reduce((sum, name) => {
    const s = shares.find((x) => x.name === name);
    if (s === undefined) {
      throw new MixError(`Component "${name}": not in this mix`, { component: name, field: "tonerNames" });
    }
    return sum + s.share;
  }, 0);
}
