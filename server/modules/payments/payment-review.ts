import { and, eq, isNull, lt, sql } from "drizzle-orm";
import { payments } from "../../db/schema";

/*
 * A flagged payment waits for the owner until they accept it or refund it in full. While one waits, the customer is
 * told the shop is checking it, it is listed first on the payments screen, and the dashboard counts it.
 */

/** Drizzle condition: this payment is flagged and still waits for the owner. */
export const awaitsReview = () => and(eq(payments.flagged, true), isNull(payments.reviewedAt), lt(payments.refundedCents, payments.amountCents));

/** The same as a 0/1 column, for ordering and counting. */
export const awaitsReviewFlag = () => sql<number>`(case when ${awaitsReview()} then 1 else 0 end)`;

export const needsReview = (p: { flagged: boolean; reviewedAt: number | null; refundedCents: number; amountCents: number }) =>
  p.flagged && p.reviewedAt === null && p.refundedCents < p.amountCents;
