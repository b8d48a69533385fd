import { LAYER_KIND_LABELS, type LayerKind } from "@shared/domain/layers";
import type { MaterialCategory } from "@shared/domain/materials";
import { layerMixProblem } from "@shared/domain/layer-mix";
import type { PlanDocumentInput, PlanDto } from "@shared/schemas/plan.schema";

/** The plan editor's form values (text, as typed) and their conversion to and from the API's plan document. */

export type EditorComponent = { materialId: string; label: string; mode: "parts" | "percent"; parts: string; percent: string; percentOf: string[] };
export type EditorLayer = {
  kind: LayerKind;
  name: string;
  coats: string;
  flashMinutes: string;
  minutesPerCoat: string;
  dryMinutes: string;
  inductionMinutes: string;
  recoatMinMinutes: string;
  recoatMaxMinutes: string;
  gunTip: string;
  pressurePsi: string;
  overlapPct: string;
  dryFilmPerCoat: string;
  dryFilmUnit: "um" | "mil";
  transferEfficiencyPct: string;
  notes: string;
  components: EditorComponent[];
};
export type EditorValues = { name: string; description: string; versionNote: string; layers: EditorLayer[] };


const str = (v: number | null | undefined) => (v == null ? "" : String(v));

export function editorValuesOf(plan: PlanDto | null): EditorValues {
  if (!plan) return { name: "", description: "", versionNote: "", layers: [] };
  return {
    name: plan.name,
    description: plan.description ?? "",
    versionNote: "",
    layers: plan.latest.layers.map((l) => ({
      kind: l.kind,
      name: l.name,
      coats: str(l.coats),
      flashMinutes: str(l.flashMinutes),
      minutesPerCoat: str(l.minutesPerCoat),
      dryMinutes: str(l.dryMinutes),
      inductionMinutes: str(l.inductionMinutes),
      recoatMinMinutes: str(l.recoatMinMinutes),
      recoatMaxMinutes: str(l.recoatMaxMinutes),
      gunTip: l.gunTip ?? "",
      pressurePsi: str(l.pressurePsi),
      overlapPct: str(l.overlapPct),
      dryFilmPerCoat: str(l.dryFilmPerCoat),
      dryFilmUnit: l.dryFilmUnit,
      transferEfficiencyPct: str(l.transferEfficiencyPct),
      notes: l.notes ?? "",
      components: l.components.map((c) => ({
        materialId: String(c.materialId),
        label: c.label,
        mode: c.percent != null ? "percent" : "parts",
        parts: str(c.parts),
        percent: str(c.percent),
        percentOf: c.percentOf ?? [],
      })),
    })),
  };
}

export const num = (v: string) => (v.trim() === "" ? null : Number(v));

/** The editor's values as the API's plan document (parts or percent, never both). */
export function toDocument(v: EditorValues): PlanDocumentInput {
  return {
    name: v.name,
    description: v.description,
    versionNote: v.versionNote,
    layers: v.layers.map((l) => ({
      kind: l.kind,
      name: l.name,
      coats: l.coats,
      flashMinutes: l.flashMinutes,
      minutesPerCoat: l.minutesPerCoat === "" ? undefined : l.minutesPerCoat,
      dryMinutes: l.dryMinutes,
      inductionMinutes: l.inductionMinutes,
      recoatMinMinutes: l.recoatMinMinutes,
      recoatMaxMinutes: l.recoatMaxMinutes,
      gunTip: l.gunTip,
      pressurePsi: l.pressurePsi,
      overlapPct: l.overlapPct,
      dryFilmPerCoat: l.dryFilmPerCoat,
      dryFilmUnit: l.dryFilmUnit,
      transferEfficiencyPct: l.transferEfficiencyPct === "" ? undefined : l.transferEfficiencyPct,
      notes: l.notes,
      components: l.components.map((c) => ({
        materialId: c.materialId,
        label: c.label.trim(),
        ...(c.mode === "parts" ? { parts: c.parts, percent: null, percentOf: null } : { parts: null, percent: c.percent, percentOf: c.percentOf }),
      })),
    })),
  };
}

/** The mix engine's check of one layer, on the editor's (string) values. */
export function mixProblemOf(components: EditorComponent[]) {
  return layerMixProblem(
    components.map((c) => ({
      label: c.label.trim(),
      parts: c.mode === "parts" ? num(c.parts) : null,
      percent: c.mode === "percent" ? num(c.percent) : null,
      percentOf: c.mode === "percent" ? c.percentOf : null,
    })),
  );
}

/** What a component of each category is called in a mix until the planner names it. */
export const MIX_NAME_OF_CATEGORY: Record<MaterialCategory, string> = {
  sealer: "sealer",
  ground_coat: "basecoat",
  toner: "toner",
  intercoat_clear: "clear",
  reducer: "reducer",
  hardener: "hardener",
  clear: "clear",
  additive: "additive",
  adhesion_promoter: "promoter",
  cleaner: "cleaner",
};

export function newLayer(kind: LayerKind = "clear"): EditorLayer {
  return {
    kind,
    name: LAYER_KIND_LABELS[kind],
    coats: "2",
    flashMinutes: "10",
    minutesPerCoat: "5",
    dryMinutes: "30",
    inductionMinutes: "",
    recoatMinMinutes: "",
    recoatMaxMinutes: "",
    gunTip: "",
    pressurePsi: "",
    overlapPct: "75",
    dryFilmPerCoat: "",
    dryFilmUnit: "um",
    transferEfficiencyPct: "65",
    notes: "",
    components: [],
  };
}

/** The label itself when free, else the label with the first free number after it ("clear 2"). */
export function uniqueLabel(base: string, taken: string[]): string {
  if (!taken.includes(base)) return base;
  for (let i = 2; ; i++) if (!taken.includes(`${base} ${i}`)) return `${base} ${i}`;
}

