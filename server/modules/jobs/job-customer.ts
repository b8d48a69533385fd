import { count, eq } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import { customers, jobMessages, jobs, payments, quotes } from "../../db/schema";
import { conflict } from "../../http/http-error";

/**
 * A job moves to another customer only while nothing has gone to its customer: once it has a quote (with its
 * payments) or an e-mail was sent about it, those belong to that customer, and moving the job would show them in the
 * other customer's portal. Refused with 409; the office makes a new job for the other customer instead.
 */
export function checkCustomerMove(deps: Pick<AppDeps, "db">, job: typeof jobs.$inferSelect, customerId: number | undefined) {
  if (customerId === undefined || customerId === job.customerId) return;
  const n = (table: typeof quotes | typeof payments | typeof jobMessages) => deps.db.select({ n: count() }).from(table).where(eq(table.jobId, job.id)).get()?.n ?? 0;
  const held = [n(quotes) && "quotes", n(payments) && "payments", n(jobMessages) && "e-mails sent to the customer"].filter(Boolean);
  if (!held.length) return;
  const name = deps.db.select({ name: customers.name }).from(customers).where(eq(customers.id, job.customerId)).get()?.name ?? "its customer";
  throw conflict(`This job has ${held.join(", ")} for ${name}, so it stays with ${name}; make a new job for the other customer instead`, {
    customerId: `Has ${held.join(", ")} for ${name}`,
  });
}
