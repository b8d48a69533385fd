import type { LayerKind } from "./layers";
import { COLOUR_LAYER_KINDS } from "./colour-sign-off";

/**
 * A change order: a change to a job after the customer approved it (a new plan version, added items, extra prep
 * found after stripping). `draft` while the shop prepares it, `sent` once the customer has it, then `approved` or
 * `declined` by the customer in the portal.
 */
export const CHANGE_ORDER_STATUSES = ["draft", "sent", "approved", "declined"] as const;
export type ChangeOrderStatus = (typeof CHANGE_ORDER_STATUSES)[number];
export const CHANGE_ORDER_STATUS_LABELS: Record<ChangeOrderStatus, string> = {
  draft: "Being prepared",
  sent: "Waiting for the customer",
  approved: "Approved by the customer",
  declined: "Declined by the customer",
};

export const CHANGE_ORDER_KINDS = ["plan", "items", "prep"] as const;
export type ChangeOrderKind = (typeof CHANGE_ORDER_KINDS)[number];
export const CHANGE_ORDER_KIND_LABELS: Record<ChangeOrderKind, string> = {
  plan: "New finish plan version",
  items: "Added items",
  prep: "Extra prep found after stripping",
};

/** What the booth card says on a layer held by a change the customer has not approved. */
export const CHANGE_WAITING = "Change waiting for the customer";

/** A change is open (holds the booth) until the customer approves or declines it. */
export const isOpenChange = (s: ChangeOrderStatus) => s === "draft" || s === "sent";

/** The part of a layer the side-by-side compares. */
export type LayerFace = { id: number; position: number; kind: LayerKind; name: string; coats: number; mix: string };
export type LayerPair = { before: LayerFace | null; after: LayerFace | null; changed: boolean };

const same = (a: LayerFace, b: LayerFace) => a.kind === b.kind && a.name === b.name && a.coats === b.coats && a.mix === b.mix;

/**
 * The two layer stacks side by side, paired by position in the stack: a layer only on one side, or one whose kind,
 * name, coats or mix differ, is changed.
 */
export function sideBySide(before: readonly LayerFace[], after: readonly LayerFace[]): LayerPair[] {
  const a = [...before].sort((x, y) => x.position - y.position);
  const b = [...after].sort((x, y) => x.position - y.position);
  return Array.from({ length: Math.max(a.length, b.length) }, (_, i) => {
    const l = a[i] ?? null;
    const r = b[i] ?? null;
    return { before: l, after: r, changed: !l || !r || !same(l, r) };
  });
}

/** Whether a change touches the colour: a colour layer (ground, candy, effect) added, removed or changed. */
export function colourChangedIn(pairs: readonly LayerPair[]): boolean {
  const colour = (f: LayerFace | null) => !!f && COLOUR_LAYER_KINDS.includes(f.kind);
  return pairs.some((p) => p.changed && (colour(p.before) || colour(p.after)));
}
