import { z } from "zod";
import { idSchema, optionalText, requiredText } from "./common.schema";
import type { PanelSignOffStatus } from "../domain/colour-sign-off";

export const MAX_PANELS_SENT = 6;

const labPart = (label: string, min: number, max: number) =>
  z.coerce.number({ error: `${label} must be a number` }).finite(`${label} must be a number`).min(min, `${label} is at least ${min}`).max(max, `${label} is at most ${max}`);

/**
 * POST /api/panels/:id/send-to-customer: this panel and up to five more of the same job, in one e-mail.
 * The ΔE00 of each is against `target` when given (e.g. the customer's sample measured at the counter), else against
 * the job's approved panel when it has one.
 */
export const sendPanelsInputSchema = z.object({
  alsoPanelIds: z
    .array(idSchema, { error: "alsoPanelIds must be a list of panel ids" })
    .max(MAX_PANELS_SENT - 1, `Send at most ${MAX_PANELS_SENT} panels at once`)
    .refine((ids) => new Set(ids).size === ids.length, "Each panel once")
    .optional(),
  to: z.email({ error: "Enter an e-mail address" }).max(254).optional(),
  message: optionalText(2000, "Message"),
  target: z
    .object({
      label: requiredText(120, "Target name"),
      labL: labPart("L*", 0, 100),
      labA: labPart("a*", -160, 160),
      labB: labPart("b*", -160, 160),
    })
    .optional(),
});
export type SendPanelsInput = z.input<typeof sendPanelsInputSchema>;

/** One panel as sent to the customer, kept as it was sent. `decidedAddress` is for the shop only. */
export type PanelSignOffDto = {
  id: number;
  jobId: number;
  panelId: number;
  status: PanelSignOffStatus;
  label: string;
  letDownClear: number;
  letDownToner: number;
  coats: number;
  targetLabel: string | null;
  /** CIEDE2000 to the target (null when the panel or the target has no reading). */
  deltaE: number | null;
  photo: { url: string; thumbUrl: string } | null;
  message: string | null;
  sentAt: string;
  decidedAt: string | null;
  decisionName: string | null;
  decidedVia: "account" | "link" | null;
  decidedAddress: string | null;
};

/** The customer's colour page: the panels waiting for an answer and those answered. */
export type PortalColourDto = {
  jobId: number;
  jobTitle: string;
  /** The job's agreed colour is a panel the customer approved here. */
  approvedPanelId: number | null;
  waiting: PanelSignOffDto[];
  answered: PanelSignOffDto[];
};

export const panelSignOffParamsSchema = z.object({ id: idSchema });
