import type { ShopSettings } from "../../../shared/schemas/settings.schema";
import { formatCents } from "../../../shared/quote/index";
import { firstName, signature, wrapHtml, type Composed } from "../messages/compose";

/** The e-mail that asks the customer to approve or decline a change to their approved job. */
export function composeChangeOrderMail(input: {
  shop: ShopSettings;
  customerName: string;
  jobTitle: string;
  changeOrderId: number;
  summary: string;
  totalCents: number;
  depositCents: number;
  colourChanged: boolean;
  link: string;
  message: string | null;
}): Composed {
  const subject = `A change to your job needs your answer: ${input.jobTitle}`;
  const price =
    input.totalCents === 0
      ? "The price stays the same."
      : input.totalCents > 0
        ? `It adds ${formatCents(input.totalCents)} to the price${input.depositCents > 0 ? `, with an extra deposit of ${formatCents(input.depositCents)} you can pay online once you approve` : ""}.`
        : `It takes ${formatCents(-input.totalCents)} off the price.`;
  const paragraphs = [
    `Hello ${firstName(input.customerName)},`,
    input.message ?? `Something on ${input.jobTitle} has changed since you approved it, and we will not go ahead with it until you say so.`,
    `Change order #${input.changeOrderId}: ${input.summary}`,
    price,
    ...(input.colourChanged ? ["The change touches the colour, so we will also send you a new test panel to approve."] : []),
    "If you decline, we carry on exactly as you approved before.",
  ];
  return {
    subject,
    text: [...paragraphs, input.link, signature(input.shop).join("\n")].join("\n\n"),
    html: wrapHtml(paragraphs, input.shop, { href: input.link, label: "See the change and answer" }),
  };
}
