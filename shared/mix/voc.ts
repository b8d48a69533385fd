import { MixError, requireNonNegative, requirePercent, requirePositive } from "./errors";
import { G_PER_LB, ML_PER_GALLON } from "./units";

/*
 * VOC content.
 *
 * Regulatory VOC ("less water and exempt compounds") of a coating prepared for application:
 *     VOC = (Wv − Ww − Wec) / (V − Vw − Vec)          [g/L]
 * with Wv, Ww, Wec the masses of all volatiles, water and exempt compounds, and V, Vw, Vec the
 * volumes of the coating, its water and its exempt compounds.
 * Actual VOC ("VOC of material") divides the same VOC mass by the whole volume V.
 *
 * A mixed batch: component i brings VOC mass m_i = VOC_i × V_i × (1 − we_i), where VOC_i is its
 * regulatory VOC and we_i the volume fraction of water + exempt compounds in it, so
 *     VOC_mix = Σ m_i / Σ V_i × (1 − we_i)           (less water and exempt)
 *     actual  = Σ m_i / Σ V_i.
 * Water added at mixing (we = 100 %) adds no VOC and drops out of the denominator.
 */

/** g/L in 1 lb/US gal: 453.59237 g / 3.785411784 L (≈ 119.826427). */
export const G_PER_L_PER_LB_PER_GAL = G_PER_LB / (ML_PER_GALLON / 1000);

export function lbPerGalToGPerL(lbPerGal: number): number {
  return requireNonNegative(lbPerGal, "lbPerGal") * G_PER_L_PER_LB_PER_GAL;
}

export function gPerLToLbPerGal(gPerL: number): number {
  return requireNonNegative(gPerL, "gPerL") / G_PER_L_PER_LB_PER_GAL;
}

export interface VocItem {
  /** Volume in the batch (any one unit for all items). */
  volume: number;
  /** Regulatory VOC of the component, g/L less water and exempt compounds. */
  vocGPerL: number;
  /** Water + exempt compounds in the component, % by volume; default 0. */
  waterExemptPct?: number;
}

function sums(items: readonly VocItem[]): { vocMass: number; volume: number; volumeLessWaterExempt: number } {
  if (!Array.isArray(items) || items.length === 0) {
    throw new MixError("items: the batch needs at least one component", { field: "items" });
  }
  let vocMass = 0;
  let volume = 0;
  let volumeLessWaterExempt = 0;
  items.forEach((item, i) => {
    const v = requirePositive(item.volume, `items[${i}].volume`);
    const voc = requireNonNegative(item.vocGPerL, `items[${i}].vocGPerL`);
    const we = requirePercent(item.waterExemptPct ?? 0, `items[${i}].waterExemptPct`, { allowZero: true }) / 100;
    const vLess = v * (1 - we);
    vocMass += voc * vLess;
    volume += v;
    volumeLessWaterExempt += vLess;
  });
  return { vocMass, volume, volumeLessWaterExempt };
}

/** VOC of the mixed, ready-to-spray batch in g/L less water and exempt compounds. */
export function mixVoc(items: readonly VocItem[]): number {
  const { vocMass, volumeLessWaterExempt } = sums(items);
  if (volumeLessWaterExempt <= 0) {
    throw new MixError("items: the batch is all water and exempt compounds, so VOC less water is undefined", {
      field: "items",
    });
  }
  return vocMass / volumeLessWaterExempt;
}

/** Actual VOC (VOC of material) of the mixed batch in g/L, water and exempt compounds included. */
export function mixVocActual(items: readonly VocItem[]): number {
  const { vocMass, volume } = sums(items);
  return vocMass / volume;
}

export interface CoatingContent {
  /** Wv: mass of all volatiles (VOC, water, exempt compounds), g. */
  volatileMassG: number;
  /** Ww: mass of water, g. */
  waterMassG: number;
  /** Wec: mass of exempt compounds, g. */
  exemptMassG: number;
  /** V: volume of the coating, L. */
  volumeL: number;
  /** Vw: volume of water, L. */
  waterVolumeL: number;
  /** Vec: volume of exempt compounds, L. */
  exemptVolumeL: number;
}

function vocMassOf(c: CoatingContent): number {
  const wv = requireNonNegative(c.volatileMassG, "volatileMassG");
  const ww = requireNonNegative(c.waterMassG, "waterMassG");
  const wec = requireNonNegative(c.exemptMassG, "exemptMassG");
  if (ww + wec > wv) {
    throw new MixError("volatileMassG: must include the water and exempt masses", { field: "volatileMassG" });
  }
  return wv - ww - wec;
}

/** Regulatory VOC, g/L less water and exempt: (Wv − Ww − Wec) / (V − Vw − Vec). */
export function regulatoryVoc(c: CoatingContent): number {
  const mass = vocMassOf(c);
  const v = requirePositive(c.volumeL, "volumeL");
  const rest = v - requireNonNegative(c.waterVolumeL, "waterVolumeL") - requireNonNegative(c.exemptVolumeL, "exemptVolumeL");
  if (rest <= 0) {
    throw new MixError("volumeL: must be larger than the water and exempt volumes", { field: "volumeL" });
  }
  return mass / rest;
}

/** Actual VOC (VOC of material), g/L: (Wv − Ww − Wec) / V. */
export function actualVoc(c: CoatingContent): number {
  return vocMassOf(c) / requirePositive(c.volumeL, "volumeL");
}

/**
 * VOC of a multi-stage finish counted as one coating (same unit in and out):
 *   (basecoat + Σ midcoats + 2 × clearcoat) / (M + 3), M = number of midcoats.
 * With no midcoat this is the two-stage average (basecoat + 2 × clearcoat) / 3.
 */
export function multiStageVoc(stages: { basecoat: number; midcoats?: readonly number[]; clearcoat: number }): number {
  const bc = requireNonNegative(stages.basecoat, "basecoat");
  const cc = requireNonNegative(stages.clearcoat, "clearcoat");
  const mids = (stages.midcoats ?? []).map((m, i) => requireNonNegative(m, `midcoats[${i}]`));
  return (bc + mids.reduce((a, b) => a + b, 0) + 2 * cc) / (mids.length + 3);
}
