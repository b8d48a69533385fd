import { MixError, resolveShares, type MixComponent } from "../mix/index";

/** A layer component as plans store it: parts, or a percent of other components named by label. */
export type LayerMixComponent = {
  label: string;
  parts?: number | null;
  percent?: number | null;
  percentOf?: readonly string[] | null;
  densityGPerMl?: number | null;
};

/** The mix engine's view of a layer's components (label → name). Densities are passed on when given. */
export function toMixComponents(components: readonly LayerMixComponent[], withDensity = false): MixComponent[] {
  // Only the fields that are set are passed on, so the engine can say "parts or percent, not both" or what is missing.
  return components.map((c) => {
    const out: Record<string, unknown> = { name: c.label };
    if (c.parts != null) out.parts = c.parts;
    if (c.percent != null) out.percent = c.percent;
    if (c.percentOf != null && (c.percentOf.length > 0 || c.percent != null)) out.percentOf = [...c.percentOf];
    if (withDensity && c.densityGPerMl != null) out.densityGPerMl = c.densityGPerMl;
    return out as unknown as MixComponent;
  });
}

export type LayerMixProblem = {
  /** Path of the field at fault inside the layer, e.g. "components.2.percentOf" or "components". */
  path: string;
  message: string;
};

const FIELD_NAMES: Record<string, string> = { name: "label", parts: "parts", percent: "percent", percentOf: "percentOf" };

/**
 * Checks that a layer's mix resolves with the mix engine; null when it does (or when the layer has no mix).
 * The problem names the component's field so the editor can show it beside that field.
 */
export function layerMixProblem(components: readonly LayerMixComponent[]): LayerMixProblem | null {
  if (components.length === 0) return null;
  try {
    resolveShares(toMixComponents(components));
    return null;
  } catch (error) {
    if (!(error instanceof MixError)) throw error;
    const index = error.component === undefined ? -1 : components.findIndex((c) => c.label === error.component);
    const field = error.field ? FIELD_NAMES[error.field] : undefined;
    if (index >= 0 && field) return { path: `components.${index}.${field}`, message: error.message };
    if (index >= 0) return { path: `components.${index}.label`, message: error.message };
    // No component named: a field-level problem of the whole mix ("at least one component in parts").
    if (error.field === "parts") {
      const first = components.findIndex((c) => c.parts == null);
      if (first >= 0) return { path: `components.${first}.parts`, message: error.message };
    }
    return { path: "components", message: error.message };
  }
}
