import { z } from "zod";
import { idSchema } from "./common.schema";

export const MESSAGE_KINDS = ["quote", "deposit_receipt", "ready_notice", "colour_panels", "change_order"] as const;
export type MessageKind = (typeof MESSAGE_KINDS)[number];
export const MESSAGE_KIND_LABELS: Record<MessageKind, string> = {
  quote: "Quote",
  deposit_receipt: "Deposit receipt",
  ready_notice: "Ready for pickup",
  colour_panels: "Colour panels to approve",
  change_order: "Change order to approve",
};

export const listMessagesQuerySchema = z.object({ jobId: idSchema });
export const readyNoticeInputSchema = z.object({ jobId: idSchema });

/** One e-mail the shop sent (or tried to send) about a job. */
export type JobMessageDto = {
  id: number;
  jobId: number;
  kind: MessageKind;
  to: string;
  subject: string;
  status: "sent" | "failed";
  error: string | null;
  attachments: string[];
  byName: string | null;
  at: string;
};
