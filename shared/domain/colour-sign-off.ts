import type { LayerKind } from "./layers";

/**
 * The customer's colour sign-off on test panels sent to the portal. `waiting` until the customer answers; the one
 * approved becomes the job's colour, the others sent with it read `not_chosen`; a panel sent again replaces its
 * earlier offer (`replaced`).
 */
export const PANEL_SIGN_OFF_STATUSES = ["waiting", "approved", "not_chosen", "replaced"] as const;
export type PanelSignOffStatus = (typeof PANEL_SIGN_OFF_STATUSES)[number];
export const PANEL_SIGN_OFF_LABELS: Record<PanelSignOffStatus, string> = {
  waiting: "Waiting for the customer",
  approved: "Approved by the customer",
  not_chosen: "Not chosen",
  replaced: "Sent again",
};

/** The layers that make the colour: the first coat of any of them waits for the customer when the shop requires it. */
export const COLOUR_LAYER_KINDS: readonly LayerKind[] = ["ground_coat", "candy", "effect_mid_coat"];

/** The shop rule's name, as the booth's refusal and the settings screen say it. */
export const COLOUR_SIGN_OFF_RULE = "Customer approves the colour before the first colour coat";
