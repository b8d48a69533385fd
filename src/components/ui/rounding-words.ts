/** A percentage small enough to read: one decimal, or "less than 0.1" when it would show as 0. */
export function smallPercent(pct: number): string {
  if (pct === 0) return "0";
  if (pct < 0.05) return "less than 0.1";
  return String(Number(pct.toFixed(1)));
}

/**
 * The headline of a rounding note, in words that never read "within 0 %":
 * - nothing moved: "every ratio is exact";
 * - moved, but inside the shop's tolerance: "the largest ratio move is 0.4 % (the shop allows 2 %)";
 * - moved beyond it: "moves 2 ratios beyond the shop's 2 % tolerance" (or "away from exact" at a 0 % tolerance).
 */
export function roundingHeadline(o: { stepText: string; worstPct: number; tolerancePct: number; movedCount: number }): string {
  const { stepText, worstPct, tolerancePct, movedCount } = o;
  if (movedCount > 0) {
    const what = movedCount === 1 ? "one ratio" : `${movedCount} ratios`;
    const beyond = tolerancePct > 0 ? `beyond the shop's ${smallPercent(tolerancePct)} % tolerance` : "away from exact";
    return `Rounding to ${stepText} moves ${what} ${beyond}:`;
  }
  if (worstPct < 1e-9) return `Rounded to ${stepText}: every ratio is exact.`;
  return `Rounded to ${stepText}: the largest ratio move is ${smallPercent(worstPct)} % (the shop allows ${smallPercent(tolerancePct)} %).`;
}
