import { and, desc, eq, gte } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import type { Db } from "../../db/client";
import type { Actor } from "../../auth/session";
import { customers, jobMessages, jobs, users } from "../../db/schema";
import { badRequest, HttpError, notFound } from "../../http/http-error";
import { iso } from "../../http/dates";
import type { MailMessage } from "../../mail/mailer";
import { getSettings } from "../settings/settings.service";
import type { JobMessageDto, MessageKind } from "../../../shared/schemas/message.schema";
import { composeReadyMail } from "./compose";

export type MessageLog = {
  jobId: number;
  quoteVersionId?: number | null;
  kind: MessageKind;
  to: string;
  subject: string;
  status: "sent" | "failed";
  error?: string | null;
  attachments?: string[];
  providerMessageId?: string | null;
  sentBy: string | null;
  at: number;
};

/** Records one e-mail on its job (inside the caller's transaction when given one). */
export function logMessage(db: Pick<Db, "insert">, m: MessageLog): number {
  return db
    .insert(jobMessages)
    .values({
      jobId: m.jobId,
      quoteVersionId: m.quoteVersionId ?? null,
      kind: m.kind,
      to: m.to,
      subject: m.subject,
      status: m.status,
      error: m.error ?? null,
      attachments: m.attachments ?? [],
      providerMessageId: m.providerMessageId ?? null,
      sentBy: m.sentBy,
      at: m.at,
    })
    .returning({ id: jobMessages.id })
    .get().id;
}

export function listMessages(deps: AppDeps, jobId: number): JobMessageDto[] {
  const job = deps.db.select({ id: jobs.id }).from(jobs).where(eq(jobs.id, jobId)).get();
  if (!job) throw notFound("Job");
  return deps.db
    .select({ m: jobMessages, byName: users.name })
    .from(jobMessages)
    .leftJoin(users, eq(jobMessages.sentBy, users.id))
    .where(eq(jobMessages.jobId, jobId))
    .orderBy(desc(jobMessages.at), desc(jobMessages.id))
    .all()
    .map(({ m, byName }) => ({
      id: m.id,
      jobId: m.jobId,
      kind: m.kind,
      to: m.to,
      subject: m.subject,
      status: m.status,
      error: m.error,
      attachments: m.attachments,
      byName: byName ?? (m.sentBy ? "Former user" : "Sent automatically"),
      at: iso(m.at),
    }));
}

/**
 * Sends one message about a job and logs it, sent or failed. A failure is rethrown (a 502 the user sees),
 * after it is logged, so the job shows the attempt.
 */
export async function sendAndLog(
  deps: AppDeps,
  log: Omit<MessageLog, "status" | "error" | "providerMessageId" | "at" | "to" | "subject" | "attachments">,
  message: MailMessage,
): Promise<{ id: number; messageId: string }> {
  const attachments = (message.attachments ?? []).map((a) => a.filename);
  try {
    const info = await deps.mailer.send(message);
    const id = logMessage(deps.db, { ...log, to: message.to, subject: message.subject, attachments, status: "sent", providerMessageId: info.messageId, at: deps.now() });
    return { id, messageId: info.messageId };
  } catch (err) {
    logMessage(deps.db, {
      ...log,
      to: message.to,
      subject: message.subject,
      attachments,
      status: "failed",
      error: err instanceof HttpError ? err.message : "The mail server refused the message",
      at: deps.now(),
    });
    throw err;
  }
}

function jobWithCustomer(deps: AppDeps, jobId: number) {
  const row = deps.db
    .select({ id: jobs.id, title: jobs.title, stage: jobs.stage, customerName: customers.name, customerEmail: customers.email })
    .from(jobs)
    .innerJoin(customers, eq(jobs.customerId, customers.id))
    .where(eq(jobs.id, jobId))
    .get();
  if (!row) throw notFound("Job");
  return row;
}

/** E-mails the customer that the job is ready to collect (the explicit "Notify customer" action). */
export async function sendReadyNotice(deps: AppDeps, sentBy: string | null, jobId: number): Promise<JobMessageDto> {
  const job = jobWithCustomer(deps, jobId);
  if (job.stage !== "ready") throw badRequest("Only a job that is ready to collect can be announced as ready", { jobId: "The job is not in Ready" });
  if (!job.customerEmail) throw badRequest("The customer has no e-mail address on file; add one to their record first", { to: "No e-mail address" });
  const mail = composeReadyMail({ shop: getSettings(deps), customerName: job.customerName, jobTitle: job.title, jobId, portalUrl: `${deps.publicUrl}/portal` });
  const { id } = await sendAndLog(deps, { jobId, kind: "ready_notice", sentBy }, { to: job.customerEmail, ...mail });
  return listMessages(deps, jobId).find((m) => m.id === id)!;
}

/** Do not announce the same job as ready twice within this time (a job moved back and forth). */
const READY_NOTICE_QUIET_MS = 12 * 3600_000;

/**
 * Called after a job's stage changes. Moving a job to Ready e-mails the customer automatically, in the
 * background: the stage change never waits for (or fails because of) the mail server; the attempt is logged
 * on the job either way, and the office can send it again with "Notify customer".
 */
export function afterStageChange(deps: AppDeps, actor: Actor, jobId: number, to: string) {
  if (to !== "ready") return;
  const recent = deps.db
    .select({ id: jobMessages.id })
    .from(jobMessages)
    .where(and(eq(jobMessages.jobId, jobId), eq(jobMessages.kind, "ready_notice"), eq(jobMessages.status, "sent"), gte(jobMessages.at, deps.now() - READY_NOTICE_QUIET_MS)))
    .get();
  if (recent) return;
  const job = deps.db.select({ email: customers.email }).from(jobs).innerJoin(customers, eq(jobs.customerId, customers.id)).where(eq(jobs.id, jobId)).get();
  if (!job?.email) return;
  void actor;
  sendReadyNotice(deps, null, jobId).catch((err) => {
    // Already logged as failed on the job by sendAndLog (when it got that far).
    if (!(err instanceof HttpError)) deps.log.error({ err, jobId }, "mail: ready notice failed");
  });
}
