/**
 * Integer-cent arithmetic for quotes. Money is always whole cents; anything fractional is rounded exactly once,
 * with one rule: half away from zero ("half-up" for the positive amounts a quote has). That is the rule of the
 * US Streamlined Sales and Use Tax Agreement §324 (carry to the third decimal, round up when it is 5 or more)
 * and of EU Regulation 1103/97 art. 5 (see ../shared/references.md §10).
 *
 * No binary floating point touches a rounding decision: percentages are turned into whole basis units first
 * and the division is done on BigInt, so 14.5 cents rounds to 15 even though 200 × 0.0725 = 14.499999… in floats.
 */

/** `numerator / denominator` rounded half away from zero. Both must be integers; the denominator positive. */
export function divRoundHalfUp(numerator: number, denominator: number): number {
  return mulDivRoundHalfUp(numerator, 1, denominator);
}

/**
 * A decimal number with at most `places` decimals as an exact integer of 10^-places units
 * (7.25 with 4 places → 72500). The input comes from a validated schema, so `Math.round` only removes
 * binary representation noise (7.25 * 10000 = 72499.99999… in some cases), never a real digit.
 */
export function toUnits(value: number, places: number): number {
  return Math.round(value * 10 ** places);
}

/** True when `value` has no more than `places` decimals (allowing for binary noise). */
export function hasAtMostDecimals(value: number, places: number): boolean {
  const scaled = value * 10 ** places;
  return Math.abs(scaled - Math.round(scaled)) < 1e-6;
}

/** `a × b / d` rounded half away from zero, exact for any safe integers (the product is taken in BigInt). */
export function mulDivRoundHalfUp(a: number, b: number, d: number): number {
  if (!Number.isSafeInteger(a) || !Number.isSafeInteger(b) || !Number.isSafeInteger(d) || d <= 0)
    throw new RangeError(`mulDivRoundHalfUp needs integers and a positive divisor (got ${a} × ${b} / ${d})`);
  const n = BigInt(a) * BigInt(b);
  const den = BigInt(d);
  const negative = n < 0n;
  const abs = negative ? -n : n;
  const q = (abs * 2n + den) / (2n * den);
  return Number(negative ? -q : q);
}

/** `cents × percent / 100`, rounded half-up to a cent; `percent` may have up to 4 decimals (8.875 %). */
export function percentOfCents(cents: number, percent: number): number {
  return mulDivRoundHalfUp(cents, toUnits(percent, 4), 100 * 10_000);
}

/**
 * Parses what a person types as a money amount ("1,234.5", "$19.99", "1.005") into cents, rounding half-up
 * on the decimal digits themselves (so "1.005" is 101 cents, where parseFloat would give 100.49999…).
 * Returns null when the text is not an amount.
 */
export function parseMoneyToCents(text: string): number | null {
  const cleaned = text.trim().replace(/^\$/, "").replace(/,/g, "").trim();
  const m = /^(-)?(\d*)(?:\.(\d*))?$/.exec(cleaned);
  if (!m || (m[2] === "" && (m[3] ?? "") === "")) return null;
  const whole = m[2] || "0";
  const frac = (m[3] ?? "").padEnd(3, "0");
  if (whole.length > 13) return null;
  const base = Number(whole) * 100 + Number(frac.slice(0, 2));
  const rest = frac.slice(2);
  // Round half-up on the digits after the cent: "5" or more in the first of them rounds up.
  const up = rest.length > 0 && Number(rest[0]) >= 5 ? 1 : 0;
  const cents = base + up;
  return m[1] ? -cents : cents;
}

/** Cents as a plain amount string without currency sign: 123456 → "1,234.56". */
export function formatAmount(cents: number): string {
  const negative = cents < 0;
  const abs = Math.abs(cents);
  const dollars = Math.floor(abs / 100).toString().replace(/\B(?=(\d{3})+(?!\d))/g, ",");
  return `${negative ? "-" : ""}${dollars}.${String(abs % 100).padStart(2, "0")}`;
}

/** Cents as US dollars: 123456 → "$1,234.56", -500 → "-$5.00". Integer arithmetic only. */
export function formatCents(cents: number): string {
  const s = formatAmount(cents);
  return s.startsWith("-") ? `-$${s.slice(1)}` : `$${s}`;
}

/** Cents as the text a money field shows when editing: 1250 → "12.50". */
export function centsToInput(cents: number | null | undefined): string {
  if (cents == null) return "";
  return formatAmount(cents).replace(/,/g, "");
}

/** A percentage for people: 7.25 → "7.25 %", 40 → "40 %". */
export function formatPercent(p: number): string {
  return `${Number(p.toFixed(4))} %`;
}
