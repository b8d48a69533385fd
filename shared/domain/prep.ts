import { needsAdhesionPromoter, type Substrate } from "./substrates";

/** What the surface was scuffed with before sealer. */
export const SCUFF_MEDIA = ["scuff_pad", "hand_sanding", "da_sanding", "media_blast", "other"] as const;
export type ScuffMedium = (typeof SCUFF_MEDIA)[number];

export const SCUFF_MEDIUM_LABELS: Record<ScuffMedium, string> = {
  scuff_pad: "Scuff pad",
  hand_sanding: "Hand sanding (block)",
  da_sanding: "DA sander",
  media_blast: "Media blast",
  other: "Other",
};

/** The steps a prep record tracks, in the order they are done. */
export const PREP_STEPS = ["scuff", "clean", "tack", "adhesionPromoter"] as const;
export type PrepStep = (typeof PREP_STEPS)[number];

export const PREP_STEP_LABELS: Record<PrepStep, string> = {
  scuff: "Scuffed",
  clean: "Cleaned",
  tack: "Tack cloth",
  adhesionPromoter: "Adhesion promoter",
};

export type PrepStepsDone = {
  scuffMedium: ScuffMedium | null;
  scuffGrit: number | null;
  cleaner: string | null;
  tackCloth: boolean;
  adhesionPromoter: boolean;
};

/** Whether the substrate needs the adhesion-promoter step (bare plastics, common practice). */
export function prepStepsFor(substrate: Substrate): PrepStep[] {
  return PREP_STEPS.filter((s) => s !== "adhesionPromoter" || needsAdhesionPromoter(substrate));
}

/** The steps still missing before the record can be signed off; empty when it is complete. */
export function missingPrepSteps(substrate: Substrate, done: PrepStepsDone): PrepStep[] {
  const missing: PrepStep[] = [];
  if (!done.scuffMedium) missing.push("scuff");
  if (!done.cleaner) missing.push("clean");
  if (!done.tackCloth) missing.push("tack");
  if (needsAdhesionPromoter(substrate) && !done.adhesionPromoter) missing.push("adhesionPromoter");
  return missing;
}

export type PrepStatus = "none" | "in_progress" | "signed_off";
export const PREP_STATUS_LABELS: Record<PrepStatus, string> = {
  none: "Not started",
  in_progress: "In progress",
  signed_off: "Signed off",
};
