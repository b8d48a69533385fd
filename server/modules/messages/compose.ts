import type { ShopSettings } from "../../../shared/schemas/settings.schema";
import { formatCents } from "../../../shared/quote/index";

/** The words of the e-mails the shop sends a customer. Plain text first; the HTML says the same. */

export type Composed = { subject: string; text: string; html: string };

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

export const firstName = (name: string) => name.trim().split(/\s+/)[0] || "there";

/** "Friday 12 March 2027" style, in English, from a YYYY-MM-DD date (no time zone games). */
export function longDate(date: string): string {
  const d = new Date(`${date}T12:00:00Z`);
  return d.toLocaleDateString("en-US", { weekday: "long", day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });
}

/** "December 2, 2026" from a YYYY-MM-DD date. */
export function mediumDate(date: string): string {
  const d = new Date(`${date}T12:00:00Z`);
  return d.toLocaleDateString("en-US", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });
}

export function signature(shop: ShopSettings): string[] {
  return [shop.shopName, shop.shopAddress, [shop.shopPhone, shop.shopEmail].filter(Boolean).join(" · ")].filter(Boolean);
}

export function wrapHtml(paragraphs: string[], shop: ShopSettings, action?: { href: string; label: string }): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 14px">${esc(p).replace(/\n/g, "<br>")}</p>`).join("");
  const button = action
    ? `<p style="margin:20px 0"><a href="${esc(action.href)}" style="display:inline-block;background:#9f1239;color:#fff;text-decoration:none;font-weight:600;padding:12px 20px;border-radius:8px">${esc(action.label)}</a></p>`
    : "";
  return `<!doctype html><html><body style="font-family:Inter,Segoe UI,Arial,sans-serif;color:#17202a;line-height:1.5;max-width:560px;margin:0 auto;padding:16px">${body}${button}<p style="margin:24px 0 0;color:#4b5866;font-size:14px">${signature(shop).map(esc).join("<br>")}</p></body></html>`;
}

export function composeQuoteMail(input: {
  shop: ShopSettings;
  customerName: string;
  jobTitle: string;
  quoteId: number;
  version: number;
  totalCents: number;
  depositCents: number;
  depositPercent: number;
  validUntil: string;
  link: string;
  linkExpiresAt: number;
  intro: string | null;
  message: string | null;
}): Composed {
  const revised = input.version > 1 ? " (revised)" : "";
  const subject = `Your quote from ${input.shop.shopName}: ${input.jobTitle}${revised}`;
  const opening = input.message ?? input.intro ?? `Thank you for asking us to paint your ${input.jobTitle.split(",")[0]!.toLowerCase()}. Here is our quote.`;
  const paragraphs = [
    `Hello ${firstName(input.customerName)},`,
    opening,
    `Quote #${input.quoteId}, version ${input.version}\nTotal: ${formatCents(input.totalCents)}\nDeposit to book the work (${input.depositPercent} %): ${formatCents(input.depositCents)}\nValid until: ${longDate(input.validUntil)}`,
    `You can read the quote, approve it and pay the deposit online. The link is personal to you and works until ${longDate(new Date(input.linkExpiresAt).toISOString().slice(0, 10))}; if you have an account with us you can also sign in and find it under My quotes.`,
    "The quote is attached as a PDF too.",
  ];
  const text = [...paragraphs.slice(0, 4), input.link, paragraphs[4], signature(input.shop).join("\n")].join("\n\n");
  return { subject, text, html: wrapHtml(paragraphs, input.shop, { href: input.link, label: "Read and approve the quote" }) };
}

export function composeReceiptMail(input: {
  shop: ShopSettings;
  customerName: string;
  jobTitle: string;
  jobId: number;
  quoteId: number;
  version: number;
  amountCents: number;
  balanceCents: number;
  paidAt: number;
  reference: string;
}): Composed {
  const subject = `Deposit received: ${input.jobTitle}`;
  const paragraphs = [
    `Hello ${firstName(input.customerName)},`,
    `We have received your deposit of ${formatCents(input.amountCents)} for job #${input.jobId}, ${input.jobTitle} (quote #${input.quoteId}, version ${input.version}). Thank you: your job is booked and we are getting the materials ready.`,
    `Paid: ${new Date(input.paidAt).toISOString().slice(0, 16).replace("T", " ")} UTC\nPayment reference: ${input.reference}\nBalance due on collection: ${formatCents(input.balanceCents)}`,
    "Keep this e-mail as your receipt. We will let you know when your parts are ready to collect.",
  ];
  return { subject, text: [...paragraphs, signature(input.shop).join("\n")].join("\n\n"), html: wrapHtml(paragraphs, input.shop) };
}

export function composeReadyMail(input: { shop: ShopSettings; customerName: string; jobTitle: string; jobId: number; portalUrl: string }): Composed {
  const subject = `Ready to collect: ${input.jobTitle}`;
  const paragraphs = [
    `Hello ${firstName(input.customerName)},`,
    `Good news: job #${input.jobId}, ${input.jobTitle}, is finished and ready for you to collect.`,
    "Fresh clear keeps curing for a few weeks: wash by hand with plain water for now, and hold off on wax or polish for about a month.",
    [input.shop.shopAddress && `Collect from: ${input.shop.shopAddress}`, input.shop.shopPhone && `Call us to arrange a time: ${input.shop.shopPhone}`].filter(Boolean).join("\n"),
  ].filter(Boolean);
  return {
    subject,
    text: [...paragraphs, `See your job: ${input.portalUrl}`, signature(input.shop).join("\n")].join("\n\n"),
    html: wrapHtml(paragraphs, input.shop, { href: input.portalUrl, label: "See your job" }),
  };
}

/** Test panels sent for the customer to choose the colour: each with its let-down, coats and ΔE00 to the target. */
export function composeColourMail(input: {
  shop: ShopSettings;
  customerName: string;
  jobTitle: string;
  jobId: number;
  panels: { label: string; letDown: string; coats: number; deltaE: number | null }[];
  targetLabel: string | null;
  link: string;
  message: string | null;
}): Composed {
  const subject = `Choose your colour: ${input.jobTitle}`;
  const one = input.panels.length === 1;
  const list = input.panels
    .map((p, i) => `${i + 1}. ${p.label}\n   Let-down (clear : toner) ${p.letDown}, ${p.coats} ${p.coats === 1 ? "coat" : "coats"}${p.deltaE != null && input.targetLabel ? `, ΔE00 ${p.deltaE.toFixed(2)} from ${input.targetLabel}` : ""}`)
    .join("\n");
  const paragraphs = [
    `Hello ${firstName(input.customerName)},`,
    input.message ?? `We have sprayed ${one ? "a test panel" : `${input.panels.length} test panels`} for job #${input.jobId}, ${input.jobTitle}. Please look at ${one ? "it" : "them"} and approve the colour you want; we spray your parts to match the panel you approve.`,
    list,
    "ΔE00 is the colour difference a meter reads: under 1 is hard to see side by side, 2 and more is easy to see. Photos on a screen never show a candy quite as it is; come and see the panels in daylight if you can.",
  ];
  return {
    subject,
    text: [...paragraphs, input.link, signature(input.shop).join("\n")].join("\n\n"),
    html: wrapHtml(paragraphs, input.shop, { href: input.link, label: one ? "See the panel and approve it" : "See the panels and choose one" }),
  };
}
