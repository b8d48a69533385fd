/**
 * Plain-words reading of a CIEDE2000 difference between a panel and the approved one, against the shop's own
 * colour tolerance (settings deltaEMatch) and its outer limit (settings deltaEClose): under the tolerance reads
 * "within tolerance", under the outer limit "borderline", otherwise "out of tolerance". The stored keys stay
 * match / close / different; only what people read is worded here.
 */
export type ColourVerdict = "match" | "close" | "different";

export const COLOUR_VERDICT_LABELS: Record<ColourVerdict, string> = {
  match: "Within tolerance",
  close: "Borderline",
  different: "Out of tolerance",
};

export function colourVerdict(deltaE: number, thresholds: { deltaEMatch: number; deltaEClose: number }): ColourVerdict {
  if (deltaE < thresholds.deltaEMatch) return "match";
  if (deltaE < thresholds.deltaEClose) return "close";
  return "different";
}

/** The short badge text, e.g. "Within tolerance (ΔE00 0.91)". */
function colourVerdictLabel(deltaE: number, verdict: ColourVerdict): string {
  return `${COLOUR_VERDICT_LABELS[verdict]} (ΔE00 ${deltaE.toFixed(2)})`;
}

/** One sentence for the screen, e.g. "Borderline (ΔE00 1.26): over the shop's tolerance of 1, under its outer limit of 2". */
export function colourVerdictText(deltaE: number, thresholds: { deltaEMatch: number; deltaEClose: number }): string {
  const v = colourVerdict(deltaE, thresholds);
  const head = colourVerdictLabel(deltaE, v);
  if (v === "match") return `${head}: under the shop's tolerance of ${thresholds.deltaEMatch}`;
  if (v === "close") return `${head}: over the shop's tolerance of ${thresholds.deltaEMatch}, under its outer limit of ${thresholds.deltaEClose}`;
  return `${head}: at or over the shop's outer limit of ${thresholds.deltaEClose}`;
}
