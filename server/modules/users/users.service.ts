import { updateAtVersion } from "../../db/edit-version";
import { and, asc, count, desc, eq, ne, or, type SQL } from "drizzle-orm";
import { contains } from "../../db/contains";
import { randomUUID } from "node:crypto";
import type { AppDeps } from "../../deps";
import { customers, users } from "../../db/schema";
import { hashPassword } from "../../auth/password";
import { badRequest, conflict, notFound } from "../../http/http-error";
import { iso } from "../../http/dates";
import { parseSort, type Page } from "../../../shared/api/pagination";
import type { CreateUserInput, ListUsersQuery, PainterDto, UpdateUserInput, UserDto } from "../../../shared/schemas/user.schema";
import type { RequestContext } from "../../http/context";
import { recordAudit } from "../audit/audit.service";

const userColumns = {
  id: users.id,
  version: users.version,
  email: users.email,
  name: users.name,
  role: users.role,
  active: users.active,
  customerId: users.customerId,
  customerName: customers.name,
  createdAt: users.createdAt,
  updatedAt: users.updatedAt,
};

type UserRow = Omit<UserDto, "createdAt" | "updatedAt"> & { createdAt: number; updatedAt: number };

const toDto = (u: UserRow): UserDto => ({
  ...u,
  createdAt: iso(u.createdAt),
  updatedAt: iso(u.updatedAt),
});

const SORT_COLUMNS = { name: users.name, email: users.email, role: users.role, createdAt: users.createdAt };

export function listUsers(deps: AppDeps, q: ListUsersQuery): Page<UserDto> {
  const filters: SQL[] = [];
  if (q.role) filters.push(eq(users.role, q.role));
  if (q.q) filters.push(or(contains(users.name, q.q), contains(users.email, q.q))!);
  const where = filters.length ? and(...filters) : undefined;
  const { field, desc: isDesc } = parseSort(q.sort);
  const col = SORT_COLUMNS[field as keyof typeof SORT_COLUMNS] ?? users.name;
  const rows = deps.db
    .select(userColumns)
    .from(users)
    .leftJoin(customers, eq(users.customerId, customers.id))
    .where(where)
    .orderBy(isDesc ? desc(col) : asc(col), asc(users.id))
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize)
    .all();
  const total = deps.db.select({ n: count() }).from(users).where(where).get()?.n ?? 0;
  return { items: rows.map(toDto), total, page: q.page, pageSize: q.pageSize };
}

export function getUser(deps: AppDeps, id: string): UserDto {
  const row = deps.db.select(userColumns).from(users).leftJoin(customers, eq(users.customerId, customers.id)).where(eq(users.id, id)).get();
  if (!row) throw notFound("User");
  return toDto(row);
}

function checkCustomerLink(deps: AppDeps, role: string, customerId: number | null | undefined) {
  if (role !== "customer") return null;
  if (customerId == null) throw badRequest("A customer account must be linked to a customer record", { customerId: "Choose the customer" });
  const exists = deps.db.select({ id: customers.id }).from(customers).where(eq(customers.id, customerId)).get();
  if (!exists) throw badRequest("That customer does not exist", { customerId: "No such customer" });
  return customerId;
}

export async function createUser(deps: AppDeps, ctx: RequestContext, input: CreateUserInput): Promise<UserDto> {
  const taken = deps.db.select({ id: users.id }).from(users).where(eq(users.email, input.email)).get();
  if (taken) throw conflict("That e-mail already has an account", { email: "Already in use" });
  const customerId = checkCustomerLink(deps, input.role, input.customerId);
  const id = randomUUID();
  const passwordHash = await hashPassword(input.password);
  deps.db.transaction((tx) => {
    tx.insert(users).values({ id, email: input.email, name: input.name, role: input.role, customerId, passwordHash }).run();
    recordAudit(tx, ctx, { kind: "user", entity: "user", entityId: id, action: "created", after: { email: input.email, name: input.name, role: input.role, customerId } }, deps.now());
  });
  return getUser(deps, id);
}

export async function updateUser(deps: AppDeps, ctx: RequestContext, id: string, input: UpdateUserInput): Promise<UserDto> {
  const actor = ctx.actor;
  const user = deps.db.select().from(users).where(eq(users.id, id)).get();
  if (!user) throw notFound("User");
  const role = input.role ?? user.role;
  const active = input.active ?? user.active;
  if (id === actor.id && (role !== user.role || !active))
    throw conflict("You cannot change your own role or switch off your own account", { role: "Ask another owner" });
  if (user.role === "owner" && (role !== "owner" || !active)) {
    const otherOwners = deps.db
      .select({ n: count() })
      .from(users)
      .where(and(eq(users.role, "owner"), eq(users.active, true), ne(users.id, id)))
      .get()?.n;
    if (!otherOwners) throw conflict("The shop needs at least one active owner", { role: "Last active owner" });
  }
  const customerId = checkCustomerLink(deps, role, input.customerId !== undefined ? input.customerId : user.customerId);
  const name = input.name ?? user.name;
  deps.db.transaction((tx) => {
    updateAtVersion(tx, users, { id, version: input.version, actorId: actor.id, what: "user" }, { name, role, active, customerId, updatedAt: deps.now() }, () => getUser(deps, id));
    const action = role !== user.role ? "role_changed" : active !== user.active ? (active ? "reactivated" : "deactivated") : "updated";
    recordAudit(
      tx,
      ctx,
      { kind: "user", entity: "user", entityId: id, action, before: { name: user.name, role: user.role, active: user.active, customerId: user.customerId }, after: { name, role, active, customerId } },
      deps.now(),
    );
  });
  if (!active || role !== user.role) await deps.lucia.invalidateUserSessions(id);
  return getUser(deps, id);
}

export function listPainters(deps: AppDeps): PainterDto[] {
  return deps.db
    .select({ id: users.id, name: users.name })
    .from(users)
    .where(and(eq(users.role, "painter"), eq(users.active, true)))
    .orderBy(asc(users.name))
    .all();
}
