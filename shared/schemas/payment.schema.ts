import { z } from "zod";
import { idSchema, optionalText } from "./common.schema";
import { QUOTE_LIMITS } from "./quote.schema";

export const checkoutInputSchema = z.object({ quoteId: idSchema });
export type CheckoutInput = z.input<typeof checkoutInputSchema>;

/** A refund of all that is left (no amount) or part of it. */
export const refundInputSchema = z.object({
  amountCents: z.coerce
    .number({ error: "Amount must be a number" })
    .int("Amount is in whole cents")
    .positive("Amount must be more than 0")
    .max(QUOTE_LIMITS.amountCents, "Amount is too large")
    .optional(),
  reason: optionalText(500, "Reason"),
});
export type RefundInput = z.input<typeof refundInputSchema>;

export const acceptPaymentInputSchema = z.object({
  note: optionalText(500, "Note"),
});

export const listPaymentsQuerySchema = z.object({
  jobId: idSchema.optional(),
  quoteId: idSchema.optional(),
  flagged: z.enum(["1", "0"]).optional(),
});

export const PAYMENT_STATUSES = ["paid", "partially_refunded", "refunded"] as const;
export type PaymentStatus = (typeof PAYMENT_STATUSES)[number];

export type RefundDto = { id: number; amountCents: number; reason: string | null; at: string; providerId: string };

export type PaymentDto = {
  id: number;
  jobId: number;
  jobTitle: string;
  customerName: string;
  quoteId: number;
  version: number;
  amountCents: number;
  /** What the quote asked for when checkout started. */
  expectedCents: number;
  currency: string;
  status: PaymentStatus;
  refundedCents: number;
  /** The amount did not match the quote's deposit, or was more than was still due (paid twice): the owner checks it. */
  flagged: boolean;
  flagReason: string | null;
  /** Flagged and still waiting for the owner: neither accepted nor refunded in full. */
  needsReview: boolean;
  reviewedAt: string | null;
  paidAt: string;
  providerPaymentId: string;
  refunds: RefundDto[];
};

export type CheckoutDto = { url: string; sessionId: string };
