/**
 * Safety cautions shown wherever a layer or batch uses a hardener (isocyanates), a 2K clear or a solvent.
 * Wording is general; the product's own safety data sheet, local codes and licensed practice always govern.
 */
export type HazardFlags = { containsIsocyanates?: boolean; flammable?: boolean };

export type Caution = { id: "isocyanates" | "flammable" | "defer"; title: string; text: string };

export const CAUTIONS: Record<Caution["id"], Caution> = {
  isocyanates: {
    id: "isocyanates",
    title: "Isocyanates (2K hardener)",
    text:
      "Can cause asthma and skin sensitisation. Wear respiratory protection suited to isocyanates (usually a " +
      "supplied-air respirator), chemical-resistant gloves, a coverall and eye protection; spray only in a " +
      "ventilated booth and keep others out while spraying.",
  },
  flammable: {
    id: "flammable",
    title: "Flammable solvents",
    text: "Vapours can ignite. No flames, sparks or smoking; ground equipment; keep containers closed; mix and spray only where ventilation is running.",
  },
  defer: {
    id: "defer",
    title: "Follow the safety data sheet",
    text: "These reminders do not replace the product's safety data sheet and technical data sheet, local codes or licensed practice.",
  },
};

/** The cautions for a set of materials (a layer's or a batch's); empty when none is hazardous. */
export function cautionsFor(materials: readonly HazardFlags[]): Caution[] {
  const iso = materials.some((m) => m.containsIsocyanates);
  const flam = materials.some((m) => m.flammable);
  if (!iso && !flam) return [];
  return [...(iso ? [CAUTIONS.isocyanates] : []), ...(flam ? [CAUTIONS.flammable] : []), CAUTIONS.defer];
}
