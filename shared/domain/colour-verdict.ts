/**
 * Plain-words reading of a CIEDE2000 difference between a panel and the approved one. The thresholds are the
 * shop's own (settings deltaEMatch / deltaEClose): below `match` reads "match", below `close` reads "close".
 */
export type ColourVerdict = "match" | "close" | "different";

export const COLOUR_VERDICT_LABELS: Record<ColourVerdict, string> = {
  match: "Match",
  close: "Close",
  different: "Different",
};

export function colourVerdict(deltaE: number, thresholds: { deltaEMatch: number; deltaEClose: number }): ColourVerdict {
  if (deltaE < thresholds.deltaEMatch) return "match";
  if (deltaE < thresholds.deltaEClose) return "close";
  return "different";
}

/** One sentence for the screen, e.g. "Close: ΔE00 1.26 (under 2.0, at or over 1.0)". */
export function colourVerdictText(deltaE: number, thresholds: { deltaEMatch: number; deltaEClose: number }): string {
  const v = colourVerdict(deltaE, thresholds);
  const d = deltaE.toFixed(2);
  if (v === "match") return `Match: ΔE00 ${d}, under the shop's match limit of ${thresholds.deltaEMatch}`;
  if (v === "close") return `Close: ΔE00 ${d}, under the shop's close limit of ${thresholds.deltaEClose} but not a match`;
  return `Different: ΔE00 ${d}, at or over the shop's close limit of ${thresholds.deltaEClose}`;
}
