import type { PaymentDto } from "@shared/schemas/payment.schema";

export const PAYMENT_STATUS_TEXT: Record<PaymentDto["status"], string> = { paid: "Paid", partially_refunded: "Partly refunded", refunded: "Refunded" };
