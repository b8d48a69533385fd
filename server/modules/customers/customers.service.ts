import { updateAtVersion } from "../../db/edit-version";
import { asc, count, desc, eq, or, sql } from "drizzle-orm";
import { contains } from "../../db/contains";
import type { AppDeps } from "../../deps";
import { customers, users } from "../../db/schema";
import { conflict, notFound } from "../../http/http-error";
import { iso } from "../../http/dates";
import { parseSort, type Page } from "../../../shared/api/pagination";
import type { CustomerDto, ListCustomersQuery } from "../../../shared/schemas/customer.schema";
import type { createCustomerInputSchema, updateCustomerInputSchema } from "../../../shared/schemas/customer.schema";
import type { z } from "zod";

// Written out in full: inside a one-table select drizzle leaves column names unqualified.
const jobCount = sql<number>`(select count(*) from "jobs" as j where j."customer_id" = "customers"."id")`.mapWith(Number);

const columns = {
  id: customers.id,
  version: customers.version,
  name: customers.name,
  email: customers.email,
  phone: customers.phone,
  address: customers.address,
  notes: customers.notes,
  jobCount,
  createdAt: customers.createdAt,
  updatedAt: customers.updatedAt,
};

type Row = { [K in keyof typeof columns]: K extends "jobCount" ? number : (typeof columns)[K] extends { _: { data: infer D } } ? D : never };

const toDto = (c: Row): CustomerDto => ({ ...c, createdAt: iso(c.createdAt), updatedAt: iso(c.updatedAt) });

const SORT = { name: customers.name, email: customers.email, createdAt: customers.createdAt, jobCount } as const;

export function listCustomers(deps: AppDeps, q: ListCustomersQuery): Page<CustomerDto> {
  const where = q.q
    ? or(contains(customers.name, q.q), contains(customers.email, q.q), contains(customers.phone, q.q))
    : undefined;
  const { field, desc: isDesc } = parseSort(q.sort);
  const col = SORT[field as keyof typeof SORT] ?? customers.name;
  const items = deps.db
    .select(columns)
    .from(customers)
    .where(where)
    .orderBy(isDesc ? desc(col) : asc(col), asc(customers.id))
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize)
    .all() as Row[];
  const total = deps.db.select({ n: count() }).from(customers).where(where).get()?.n ?? 0;
  return { items: items.map(toDto), total, page: q.page, pageSize: q.pageSize };
}

export function getCustomer(deps: AppDeps, id: number): CustomerDto {
  const row = deps.db.select(columns).from(customers).where(eq(customers.id, id)).get() as Row | undefined;
  if (!row) throw notFound("Customer");
  return toDto(row);
}

export function createCustomer(deps: AppDeps, input: z.output<typeof createCustomerInputSchema>): CustomerDto {
  const row = deps.db
    .insert(customers)
    .values({ name: input.name, email: input.email ?? null, phone: input.phone ?? null, address: input.address ?? null, notes: input.notes ?? null })
    .returning({ id: customers.id })
    .get();
  return getCustomer(deps, row.id);
}

export function updateCustomer(deps: AppDeps, actorId: string, id: number, input: z.output<typeof updateCustomerInputSchema>): CustomerDto {
  getCustomer(deps, id);
  const { version, ...fields } = input;
  updateAtVersion(deps.db, customers, { id, version, actorId, what: "customer" }, { ...fields, updatedAt: deps.now() }, () => getCustomer(deps, id));
  return getCustomer(deps, id);
}

/** A customer with jobs or a portal account is kept: their history matters. */
export function deleteCustomer(deps: AppDeps, id: number) {
  const c = getCustomer(deps, id);
  if (c.jobCount > 0) throw conflict(`${c.name} has ${c.jobCount} job(s); cancel or keep them instead of deleting the customer`);
  const account = deps.db.select({ id: users.id }).from(users).where(eq(users.customerId, id)).get();
  if (account) throw conflict(`${c.name} has a portal account; remove it first`);
  deps.db.delete(customers).where(eq(customers.id, id)).run();
}
