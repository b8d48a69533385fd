import { z } from "zod";
import { fromDigits, idSchema, isoDateSchema, optionalText, requiredText, versionSchema } from "./common.schema";
import { pageQuerySchema, sortSchema } from "../api/pagination";
import { hasAtMostDecimals } from "../quote/money";
import type { PortalInspectionDto } from "./inspection.schema";
import type { Stage } from "../domain/stages";
import { QUOTE_LINE_KINDS, TAXABLE_KINDS, type QuoteLine, type QuoteLineKind, type QuoteTotals, type TaxableKind, type TaxRounding } from "../quote/totals";

/** What a quote shows as its status. `expired` is never stored: a sent quote past its valid-until date reads as expired. */
export const QUOTE_STATUSES = ["draft", "sent", "viewed", "approved", "declined", "expired"] as const;
export type QuoteStatus = (typeof QUOTE_STATUSES)[number];
/** The statuses a quote version row holds. */
export const STORED_QUOTE_STATUSES = ["draft", "sent", "viewed", "approved", "declined"] as const;
export type StoredQuoteStatus = (typeof STORED_QUOTE_STATUSES)[number];

export const QUOTE_STATUS_LABELS: Record<QuoteStatus, string> = {
  draft: "Draft",
  sent: "Sent",
  viewed: "Viewed",
  approved: "Approved",
  declined: "Declined",
  expired: "Expired",
};

export const QUOTE_LIMITS = {
  lines: 60,
  hours: 1000,
  rateCents: 1_000_000,
  amountCents: 100_000_000,
  markupPercent: 500,
} as const;

const num = (label: string) => z.coerce.number({ error: `${label} must be a number` }).refine(Number.isFinite, `${label} must be a number`);
const cents = (label: string, max: number = QUOTE_LIMITS.amountCents) =>
  num(label).pipe(z.number().int(`${label} is in whole cents`).min(0, `${label} cannot be negative`).max(max, `${label} is too large`));
const decimals = (label: string, max: number, places: number) =>
  num(label).pipe(
    z
      .number()
      .min(0, `${label} cannot be negative`)
      .max(max, `${label} is limited to ${max}`)
      .refine((v) => hasAtMostDecimals(v, places), `${label} takes at most ${places} decimals`),
  );

/**
 * One line of a quote (see shared/quote/totals.ts for what each field means per kind).
 * The fields a kind needs are checked here, so a bad line is named field by field ("lines.2.hours").
 */
export const quoteLineSchema = z
  .object({
    kind: z.enum(QUOTE_LINE_KINDS, { error: `Line kind must be one of: ${QUOTE_LINE_KINDS.join(", ")}` }),
    description: requiredText(200, "Description"),
    hours: decimals("Hours", QUOTE_LIMITS.hours, 2).nullable().optional(),
    rateCents: cents("Rate", QUOTE_LIMITS.rateCents).nullable().optional(),
    costCents: cents("Cost").nullable().optional(),
    markupPercent: decimals("Markup", QUOTE_LIMITS.markupPercent, 2).nullable().optional(),
    basis: z.enum(["percent", "fixed"], { error: "Choose percent or fixed amount" }).nullable().optional(),
    percent: decimals("Percent", 100, 2).nullable().optional(),
    amountCents: cents("Amount").nullable().optional(),
    layerId: idSchema.nullable().optional(),
  })
  .superRefine((line, ctx) => {
    const need = (field: keyof typeof line, message: string) => {
      if (line[field] == null) ctx.addIssue({ code: "custom", path: [field], message });
    };
    switch (line.kind) {
      case "labour":
        need("hours", "Hours are required");
        need("rateCents", "Rate is required");
        break;
      case "materials":
        need("costCents", "Cost is required");
        need("markupPercent", "Markup is required (0 for none)");
        break;
      case "sublet":
        need("amountCents", "Amount is required");
        break;
      case "supplies":
      case "discount":
        if (line.basis !== "percent" && line.basis !== "fixed") ctx.addIssue({ code: "custom", path: ["basis"], message: "Choose percent or fixed amount" });
        else if (line.basis === "percent") need("percent", "Percent is required");
        else need("amountCents", "Amount is required");
        break;
    }
  });
export type QuoteLineInput = z.input<typeof quoteLineSchema>;

const taxPercentSchema = decimals("Tax", 100, 4);
const depositPercentSchema = decimals("Deposit", 100, 2);

export const createQuoteInputSchema = z.object({ jobId: idSchema });
export type CreateQuoteInput = z.input<typeof createQuoteInputSchema>;

/** Edits to the quote's current version. On a draft they change it; on a sent quote they make a new version. */
export const updateQuoteInputSchema = z.object({
  lines: z.array(quoteLineSchema).max(QUOTE_LIMITS.lines, `At most ${QUOTE_LIMITS.lines} lines`).optional(),
  validUntil: isoDateSchema.optional(),
  intro: optionalText(2000, "Message"),
  terms: optionalText(4000, "Terms"),
  finishText: optionalText(1000, "Finish description"),
  taxPercent: taxPercentSchema.optional(),
  taxedKinds: z.array(z.enum(TAXABLE_KINDS, { error: `Taxed kinds are: ${TAXABLE_KINDS.join(", ")}` })).max(4).optional(),
  taxRounding: z.enum(["invoice", "line"], { error: "Tax is rounded per invoice or per line" }).optional(),
  depositPercent: depositPercentSchema.optional(),
  /** The quote's edit version the change was made from (`version` is the quote's own version number). */
  editVersion: versionSchema,
});
export type UpdateQuoteInput = z.input<typeof updateQuoteInputSchema>;

export const sendQuoteInputSchema = z.object({
  /** Defaults to the customer's e-mail address on file. */
  to: z.email({ error: "Enter an e-mail address" }).max(254).optional(),
  message: optionalText(2000, "Message"),
});
export type SendQuoteInput = z.input<typeof sendQuoteInputSchema>;

export const QUOTE_SORT_FIELDS = ["id", "updatedAt", "total", "validUntil"] as const;
export const listQuotesQuerySchema = pageQuerySchema.extend({
  jobId: idSchema.optional(),
  status: z.enum(QUOTE_STATUSES, { error: `Status must be one of: ${QUOTE_STATUSES.join(", ")}` }).optional(),
  sort: sortSchema(QUOTE_SORT_FIELDS, "updatedAt"),
});
export type ListQuotesQuery = z.infer<typeof listQuotesQuerySchema>;

export const quoteVersionParamsSchema = z.object({
  id: idSchema,
  version: z.preprocess(fromDigits, z.number({ error: "Version must be a number" }).int("Version is a whole number").min(1, "Versions start at 1").max(10_000)),
});

export const quotePdfQuerySchema = z.object({
  version: z.preprocess(fromDigits, z.number({ error: "Version must be a number" }).int().min(1).max(10_000)).optional(),
});

/** The customer's answer. Approving asks for their name as a signature. */
export const approveQuoteInputSchema = z.object({
  name: requiredText(120, "Your name"),
  note: optionalText(1000, "Note"),
});
export type ApproveQuoteInput = z.input<typeof approveQuoteInputSchema>;

export const declineQuoteInputSchema = z.object({
  reason: optionalText(1000, "Reason"),
});
export type DeclineQuoteInput = z.input<typeof declineQuoteInputSchema>;

export type QuoteVersionSummary = {
  version: number;
  status: QuoteStatus;
  totalCents: number;
  createdAt: string;
  sentAt: string | null;
  supersededAt: string | null;
};

export type QuoteVersionDto = {
  id: number;
  quoteId: number;
  version: number;
  status: QuoteStatus;
  lines: QuoteLine[];
  totals: QuoteTotals;
  taxPercent: number;
  taxedKinds: TaxableKind[];
  taxRounding: TaxRounding;
  depositPercent: number;
  validUntil: string;
  intro: string | null;
  terms: string | null;
  finishText: string | null;
  createdAt: string;
  updatedAt: string;
  createdByName: string | null;
  sentAt: string | null;
  sentTo: string | null;
  viewedAt: string | null;
  decidedAt: string | null;
  decidedVia: "account" | "link" | null;
  decisionName: string | null;
  decisionNote: string | null;
  decidedAddress: string | null;
  supersededAt: string | null;
};

/** A quote in lists: its latest version's figures. */
export type QuoteDto = {
  id: number;
  jobId: number;
  jobTitle: string;
  customerId: number;
  customerName: string;
  customerEmail: string | null;
  version: number;
  status: QuoteStatus;
  totalCents: number;
  depositCents: number;
  validUntil: string;
  sentAt: string | null;
  updatedAt: string;
  /** Deposits received (less refunds) against any version of this quote. */
  paidCents: number;
};

export type QuoteDetailDto = QuoteDto & {
  /** The edit version: goes up with every change; an edit sends the one it read (as `editVersion`). */
  editVersion: number;
  current: QuoteVersionDto;
  versions: QuoteVersionSummary[];
  /** What the customer is currently looking at: the latest version that was sent (null while only a draft exists). */
  offeredVersion: number | null;
  /** True when the job has a finish plan whose estimate can fill the materials lines. */
  planAvailable: boolean;
  /** Layers the plan's estimate could not cost, with why (for the estimator). */
  planProblems: string[];
};

/** A line as a customer reads it: price only, never the shop's cost or markup. */
export type PortalQuoteLine = { kind: QuoteLineKind; description: string; detail: string | null; amountCents: number };

export type PortalQuoteDto = {
  id: number;
  version: number;
  status: QuoteStatus;
  jobId: number;
  jobTitle: string;
  jobStage: string;
  customerName: string;
  shop: { name: string; address: string; phone: string; email: string };
  items: { name: string; substrate: string; surfaceArea: number; areaUnit: string }[];
  finishText: string | null;
  lines: PortalQuoteLine[];
  subtotalCents: number;
  discountCents: number;
  taxCents: number;
  taxLabel: string;
  totalCents: number;
  depositCents: number;
  depositPercent: number;
  balanceCents: number;
  validUntil: string;
  intro: string | null;
  terms: string | null;
  sentAt: string | null;
  decidedAt: string | null;
  decisionName: string | null;
  /** Deposit received (less refunds). */
  paidCents: number;
  /** A payment arrived that the shop is checking (amount did not match). */
  paymentUnderReview: boolean;
  canDecide: boolean;
  canPay: boolean;
  /** The intake inspection the quote was made from (findings and shared photos), when the shop did one. */
  inspection: PortalInspectionDto | null;
};

export type PortalPhotoDto = { id: number; caption: string | null; url: string; thumbUrl: string; takenAt: string };

export type PortalJobDto = {
  id: number;
  title: string;
  stage: Stage;
  dueDate: string | null;
  items: { name: string; substrate: string; surfaceArea: number; areaUnit: string }[];
  finishText: string | null;
  photos: PortalPhotoDto[];
  quotes: { id: number; version: number; status: QuoteStatus; totalCents: number; depositCents: number; paidCents: number }[];
};

/** One of the customer's quotes in a list. */
export type PortalQuoteSummaryDto = {
  id: number;
  version: number;
  status: QuoteStatus;
  jobId: number;
  jobTitle: string;
  totalCents: number;
  depositCents: number;
  paidCents: number;
  validUntil: string;
  sentAt: string | null;
};

/** Who the portal is talking to: a signed-in customer, or a visitor holding a quote link. */
export type PortalSessionDto = {
  via: "account" | "link";
  customerName: string;
  /** With a link: the one quote it opens. */
  quoteId: number | null;
  expiresAt: string | null;
};

export const QUOTE_LINE_KIND_HINT: Record<QuoteLineKind, string> = {
  labour: "Hours × rate",
  materials: "Cost plus markup",
  supplies: "Percent of labour, or a fixed amount",
  sublet: "Work done for the job by another shop (plating, upholstery…)",
  discount: "Percent of the charges, or a fixed amount",
};

export type { QuoteLine, QuoteTotals, TaxableKind };
