import type { AreaUnit, Substrate } from "./substrates";

/**
 * The intake inspection: what the estimator finds on each item before quoting, and the prep hours it suggests.
 * Every hour figure below is a shop rule of thumb (common practice), not a measured standard: the estimator reads the
 * suggestion and may change the hours on the quote line.
 */

/** What is on the item now. */
export const EXISTING_FINISHES = ["bare", "primer", "factory_finish", "old_custom_finish", "powder_coat", "unknown"] as const;
export type ExistingFinish = (typeof EXISTING_FINISHES)[number];
export const EXISTING_FINISH_LABELS: Record<ExistingFinish, string> = {
  bare: "Bare substrate",
  primer: "Primer only",
  factory_finish: "Factory finish",
  old_custom_finish: "Earlier custom finish",
  powder_coat: "Powder coat",
  unknown: "Not known",
};

/** How much of a defect there is. */
export const FINDING_LEVELS = ["none", "minor", "major"] as const;
export type FindingLevel = (typeof FINDING_LEVELS)[number];
export const FINDING_LEVEL_LABELS: Record<FindingLevel, string> = { none: "None", minor: "Minor", major: "Major" };

/** The condition checklist, item by item. Pinholes and stress cracks are looked for in fibreglass. */
export const FINDINGS = ["dents", "cracks", "pinholes", "stressCracks", "rust", "earlierRepairs"] as const;
export type Finding = (typeof FINDINGS)[number];
export const FINDING_LABELS: Record<Finding, string> = {
  dents: "Dents",
  cracks: "Cracks",
  pinholes: "Pinholes (fibreglass)",
  stressCracks: "Stress cracks (fibreglass)",
  rust: "Rust",
  earlierRepairs: "Earlier repairs",
};
export const FIBREGLASS_FINDINGS: readonly Finding[] = ["pinholes", "stressCracks"];
export const isFibreglass = (s: Substrate) => s === "fiberglass";

/**
 * A rag with lacquer thinner held on the existing finish: a cured two-component finish is unaffected; a finish that
 * softens wants a barrier sealer; one that lifts or wrinkles has to come off (common practice).
 */
export const SOLVENT_TEST_RESULTS = ["not_done", "unaffected", "softens", "lifts"] as const;
export type SolventTestResult = (typeof SOLVENT_TEST_RESULTS)[number];
export const SOLVENT_TEST_LABELS: Record<SolventTestResult, string> = {
  not_done: "Not done",
  unaffected: "Unaffected: sound to build on",
  softens: "Softens: seal it first",
  lifts: "Lifts or wrinkles: strip it",
};

/** Hours per m² of surface (common practice). */
const PER_M2 = {
  base: 1, // scuff, clean and mask any item
  strip: 2.5, // a finish that lifts, or powder coat, comes off
  seal: 0.5, // barrier sealer over a finish that softens
  rust: { minor: 1, major: 3 },
  pinholes: { minor: 0.5, major: 1.5 },
} as const;
/** Hours per item (common practice). */
const PER_ITEM = {
  dents: { minor: 0.5, major: 2 },
  cracks: { minor: 0.5, major: 2 },
  stressCracks: { minor: 1, major: 3 },
  earlierRepairs: { minor: 0.5, major: 1.5 },
  hardware: 0.5,
} as const;

/** m² per ft²: 0.3048² exactly (NIST SP 811, foot = 0.3048 m). */
export const M2_PER_FT2 = 0.09290304;
export const toSquareMetres = (area: number, unit: AreaUnit) => (unit === "m2" ? area : area * M2_PER_FT2);

export type InspectedItem = {
  name: string;
  area: number;
  areaUnit: AreaUnit;
  existingFinish: ExistingFinish;
  solventTest: SolventTestResult;
  hardwareToRemove: string | null;
} & Record<Finding, FindingLevel>;

export type PrepReason = { what: string; hours: number };
export type ItemPrepSuggestion = { hours: number; reasons: PrepReason[] };

/** Rounds hours up to the next quarter hour (a quote line takes two decimals). */
export const quarterHoursUp = (h: number) => Math.ceil(Math.round(h * 1e6) / 1e6 / 0.25) * 0.25;

/** The prep one item needs by its inspection, with each reason and its hours. */
export function suggestItemPrep(item: InspectedItem): ItemPrepSuggestion {
  const m2 = toSquareMetres(item.area, item.areaUnit);
  const reasons: PrepReason[] = [{ what: "scuff, clean and mask", hours: PER_M2.base * m2 }];
  const strip = item.solventTest === "lifts" || item.existingFinish === "powder_coat";
  if (strip) reasons.push({ what: item.existingFinish === "powder_coat" ? "strip the powder coat" : "strip the finish that lifts", hours: PER_M2.strip * m2 });
  else if (item.solventTest === "softens") reasons.push({ what: "barrier sealer over a finish that softens", hours: PER_M2.seal * m2 });
  for (const f of ["rust", "pinholes"] as const) if (item[f] !== "none") reasons.push({ what: `${FINDING_LABELS[f].toLowerCase()} (${item[f]})`, hours: PER_M2[f][item[f]] * m2 });
  for (const f of ["dents", "cracks", "stressCracks", "earlierRepairs"] as const) if (item[f] !== "none") reasons.push({ what: `${FINDING_LABELS[f].toLowerCase()} (${item[f]})`, hours: PER_ITEM[f][item[f]] });
  if (item.hardwareToRemove) reasons.push({ what: "remove and refit hardware", hours: PER_ITEM.hardware });
  return { hours: quarterHoursUp(reasons.reduce((s, r) => s + r.hours, 0)), reasons: reasons.map((r) => ({ ...r, hours: Math.round(r.hours * 100) / 100 })) };
}

/** The findings of an item in words ("rust (minor)", "hardware to remove: …"), for the quote line and the customer. */
export function findingWords(item: Pick<InspectedItem, Finding | "hardwareToRemove">): string[] {
  const out = FINDINGS.filter((f) => item[f] !== "none").map((f) => `${FINDING_LABELS[f].replace(/ \(fibreglass\)/, "").toLowerCase()} (${item[f]})`);
  if (item.hardwareToRemove) out.push(`hardware to remove: ${item.hardwareToRemove}`);
  return out;
}

/** The quote line's description: what the prep is for, within a quote line's 200 characters. */
export function prepLineDescription(items: { name: string; findings: string[] }[]): string {
  const found = items.filter((i) => i.findings.length).map((i) => `${i.name}: ${i.findings.join(", ")}`);
  const text = `Prep found at intake inspection${found.length ? ` (${found.join("; ")})` : ""}`;
  return text.length <= 200 ? text : `${text.slice(0, 197)}…`;
}
export const PREP_LINE_PREFIX = "Prep found at intake inspection";
