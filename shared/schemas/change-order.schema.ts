import { z } from "zod";
import { idSchema, optionalText, requiredText, versionSchema } from "./common.schema";
import { QUOTE_LIMITS, quoteLineSchema } from "./quote.schema";
import { CHANGE_ORDER_KINDS, type ChangeOrderKind, type ChangeOrderStatus, type LayerPair } from "../domain/change-orders";
import type { QuoteLine } from "../quote/index";

const linesSchema = z.array(quoteLineSchema).max(QUOTE_LIMITS.lines, `At most ${QUOTE_LIMITS.lines} lines`);

/** The shop opens a change order on an approved job. A plan change names the new version (else the plan's latest). */
export const createChangeOrderInputSchema = z.object({
  kind: z.enum(CHANGE_ORDER_KINDS, { error: `Kind must be one of: ${CHANGE_ORDER_KINDS.join(", ")}` }),
  summary: requiredText(2000, "What changed"),
  colourChanged: z.boolean({ error: "colourChanged is true or false" }).optional(),
  lines: linesSchema.optional(),
  planVersionId: idSchema.optional(),
});
export type CreateChangeOrderInput = z.input<typeof createChangeOrderInputSchema>;

/** Edits to a change order the customer does not have yet (a draft). */
export const updateChangeOrderInputSchema = z.object({
  summary: requiredText(2000, "What changed").optional(),
  colourChanged: z.boolean({ error: "colourChanged is true or false" }).optional(),
  lines: linesSchema.optional(),
  version: versionSchema,
});
export type UpdateChangeOrderInput = z.input<typeof updateChangeOrderInputSchema>;

export const sendChangeOrderInputSchema = z.object({
  /** Defaults to the customer's e-mail address on file. */
  to: z.email({ error: "Enter an e-mail address" }).max(254).optional(),
  message: optionalText(2000, "Message"),
});
export type SendChangeOrderInput = z.input<typeof sendChangeOrderInputSchema>;

/** The price difference of a change order: quote lines with the quote's totals. Only the office and the customer see it. */
export type ChangeOrderMoneyDto = {
  lines: QuoteLine[];
  lineCents: number[];
  subtotalCents: number;
  taxCents: number;
  taxPercent: number;
  totalCents: number;
  depositPercent: number;
  depositCents: number;
  paidCents: number;
};

export type ChangeOrderDto = {
  id: number;
  jobId: number;
  jobTitle: string;
  kind: ChangeOrderKind;
  status: ChangeOrderStatus;
  summary: string;
  colourChanged: boolean;
  fromVersion: { id: number; version: number } | null;
  toVersion: { id: number; version: number } | null;
  layers: LayerPair[];
  /** Layers of the version the booth works from that this change would alter. */
  affectedLayerIds: number[];
  sentAt: string | null;
  sentTo: string | null;
  decidedAt: string | null;
  decidedVia: "account" | "link" | null;
  decisionName: string | null;
  decisionNote: string | null;
  /** The office only. */
  decidedAddress: string | null;
  createdAt: string;
  createdByName: string | null;
  version: number;
  /** Absent for painters. */
  money?: ChangeOrderMoneyDto;
  /** For the customer: the extra deposit can be paid online now. */
  canPay?: boolean;
};
