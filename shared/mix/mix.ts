import { MixError, requirePositive } from "./errors";
import { convertVolume, requireVolumeUnit, type VolumeUnit } from "./units";

/*
 * A mix is a list of components. Each is either
 *   - a parts component: `{ name, parts }` — parts by volume, as in 4:1:1 or 100:25:10, or
 *   - a percent component: `{ name, percent, percentOf }` — its volume is `percent` % of the summed
 *     volume of the named components (which may themselves be parts or percent components):
 *     "reduce 10 %" is `{ name: 'reducer', percent: 10, percentOf: 'base' }`; a reduced candy
 *     let-down is `{ name: 'reducer', percent: 5, percentOf: ['clear', 'toner'] }`.
 * Volumes are assumed to add (no shrinkage on mixing).
 */

export interface PartsComponent {
  name: string;
  parts: number;
  /** Density in g/mL, to give scale weights. */
  densityGPerMl?: number;
}

export interface PercentComponent {
  name: string;
  percent: number;
  percentOf: string | string[];
  densityGPerMl?: number;
}

export type MixComponent = PartsComponent | PercentComponent;

export interface ComponentShare {
  name: string;
  /** Volume relative to the parts components (a parts component's value is its parts). */
  relative: number;
  /** Fraction of the whole batch by volume (all shares sum to 1). */
  share: number;
}

export interface MixLine {
  name: string;
  volume: number;
  unit: VolumeUnit;
  /** Fraction of the whole batch by volume. */
  share: number;
  /** Weight on a scale, when the component has a density. */
  grams?: number;
}

/** A key set to undefined (as forms and parsers often leave them) counts as absent. */
function has(c: object, key: string): boolean {
  return (c as Record<string, unknown>)[key] !== undefined;
}

function isPercentComponent(c: MixComponent): c is PercentComponent {
  return has(c, "percent") || has(c, "percentOf");
}

/** Checks one component's own fields; returns its percentOf names (empty for parts components). */
function checkComponent(c: MixComponent, index: number): string[] {
  if (typeof c !== "object" || c === null) {
    throw new MixError(`Component #${index + 1}: must be an object`, { field: "components" });
  }
  const name = c.name;
  if (typeof name !== "string" || name.trim() === "") {
    throw new MixError(`Component #${index + 1}: needs a name`, { field: "name" });
  }
  if (c.densityGPerMl !== undefined) requirePositive(c.densityGPerMl, "densityGPerMl", name);

  if (!isPercentComponent(c)) {
    if (!has(c, "parts")) {
      throw new MixError(`Component "${name}": needs either parts or percent with percentOf`, {
        component: name,
        field: "parts",
      });
    }
    requirePositive(c.parts, "parts", name);
    return [];
  }
  if (has(c, "parts")) {
    throw new MixError(`Component "${name}": give either parts or percent, not both`, {
      component: name,
      field: "parts",
    });
  }
  requirePositive(c.percent, "percent", name);
  const of = typeof c.percentOf === "string" ? [c.percentOf] : c.percentOf;
  if (!Array.isArray(of) || of.length === 0 || of.some((n) => typeof n !== "string")) {
    throw new MixError(`Component "${name}": percentOf must name at least one component`, {
      component: name,
      field: "percentOf",
    });
  }
  if (new Set(of).size !== of.length) {
    throw new MixError(`Component "${name}": percentOf names the same component twice`, {
      component: name,
      field: "percentOf",
    });
  }
  return of;
}

/**
 * Each component's share of the whole batch by volume, in the given order. Validates the list and
 * throws a MixError naming the component at fault.
 */
export function resolveShares(components: readonly MixComponent[]): ComponentShare[] {
  if (!Array.isArray(components) || components.length === 0) {
    throw new MixError("components: the mix needs at least one component", { field: "components" });
  }
  const byName = new Map<string, { component: MixComponent; of: string[] }>();
  components.forEach((c, i) => {
    const of = checkComponent(c, i);
    if (byName.has(c.name)) {
      throw new MixError(`Component "${c.name}": the name is used twice`, { component: c.name, field: "name" });
    }
    byName.set(c.name, { component: c, of });
  });
  for (const [name, { of }] of byName) {
    for (const other of of) {
      if (other === name) {
        throw new MixError(`Component "${name}": percentOf cannot name the component itself`, {
          component: name,
          field: "percentOf",
        });
      }
      if (!byName.has(other)) {
        throw new MixError(`Component "${name}": percentOf names unknown component "${other}"`, {
          component: name,
          field: "percentOf",
        });
      }
    }
  }
  if (!components.some((c) => !isPercentComponent(c))) {
    throw new MixError("components: at least one component must be given in parts", { field: "parts" });
  }

  // Relative volume: parts for a parts component; percent/100 × Σ(relative volume of the named
  // components) for a percent component. Depth-first with a visiting set to catch cycles.
  const relative = new Map<string, number>();
  const visiting: string[] = [];
  const resolve = (name: string): number => {
    const known = relative.get(name);
    if (known !== undefined) return known;
    const start = visiting.indexOf(name);
    if (start >= 0) {
      const loop = [...visiting.slice(start), name].map((n) => `"${n}"`).join(" → ");
      throw new MixError(`Component "${name}": percentOf forms a cycle (${loop})`, {
        component: name,
        field: "percentOf",
      });
    }
    const { component, of } = byName.get(name)!;
    visiting.push(name);
    const value = isPercentComponent(component)
      ? (component.percent / 100) * of.reduce((sum, n) => sum + resolve(n), 0)
      : component.parts;
    visiting.pop();
    relative.set(name, value);
    return value;
  };

  const values = components.map((c) => resolve(c.name));
  const sum = values.reduce((a, b) => a + b, 0);
  if (!Number.isFinite(sum)) {
    throw new MixError("components: the parts are too large to add up", { field: "parts" });
  }
  return components.map((c, i) => ({ name: c.name, relative: values[i]!, share: values[i]! / sum }));
}

function toLine(c: MixComponent, s: ComponentShare, volume: number, unit: VolumeUnit): MixLine {
  const line: MixLine = { name: c.name, volume, unit, share: s.share };
  if (c.densityGPerMl !== undefined) line.grams = convertVolume(volume, unit, "mL") * c.densityGPerMl;
  return line;
}

/** Splits a wanted batch `total` (in `unit`) over the components by their shares. */
export function mixForTotal(components: readonly MixComponent[], total: number, unit: VolumeUnit): MixLine[] {
  const shares = resolveShares(components);
  requirePositive(total, "total");
  const u = requireVolumeUnit(unit);
  const sum = shares.reduce((a, s) => a + s.relative, 0);
  // volume_i = total × relative_i / Σ relative
  return components.map((c, i) => toLine(c, shares[i]!, (total * shares[i]!.relative) / sum, u));
}

/**
 * Scales the mix from the amount of one component on hand (`amount` of `knownName`, in `unit`).
 * The known component's line is exactly `amount`.
 */
export function mixFromComponent(
  components: readonly MixComponent[],
  knownName: string,
  amount: number,
  unit: VolumeUnit,
): MixLine[] {
  const shares = resolveShares(components);
  const known = shares.find((s) => s.name === knownName);
  if (known === undefined) {
    throw new MixError(`Component "${knownName}": not in this mix`, { component: knownName, field: "knownName" });
  }
  requirePositive(amount, "amount", knownName);
  const u = requireVolumeUnit(unit);
  // volume_i = amount × relative_i / relative_known
  return components.map((c, i) => toLine(c, shares[i]!, amount * (shares[i]!.relative / known.relative), u));
}
