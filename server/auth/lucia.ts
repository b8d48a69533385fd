import { Lucia, TimeSpan, type DatabaseSession, type DatabaseUser } from "lucia";
import { DrizzleSQLiteAdapter } from "@lucia-auth/adapter-drizzle";
import { eq, sql } from "drizzle-orm";
import type { Db } from "../db/client";
import { sessions, users } from "../db/schema";
import type { Role } from "../../shared/domain/roles";

/**
 * The stock adapter, except that every request's session lookup is one prepared query (session joined to its user,
 * only the columns the app reads) rather than two queries built afresh.
 */
class SessionAdapter extends DrizzleSQLiteAdapter {
  private readonly sessionAndUser;
  constructor(db: Db) {
    super(db, sessions, users);
    this.sessionAndUser = db
      .select({ id: sessions.id, userId: sessions.userId, expiresAt: sessions.expiresAt, email: users.email, name: users.name, role: users.role, customerId: users.customerId, active: users.active })
      .from(sessions)
      .innerJoin(users, eq(sessions.userId, users.id))
      .where(eq(sessions.id, sql.placeholder("id")))
      .prepare();
  }

  override async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    const row = this.sessionAndUser.get({ id: sessionId });
    if (!row) return [null, null];
    const { id, userId, expiresAt, ...attributes } = row;
    return [{ id, userId, expiresAt: new Date(expiresAt * 1000), attributes: {} }, { id: userId, attributes }];
  }
}

export function createLucia(db: Db) {
  const adapter = new SessionAdapter(db);
  return new Lucia(adapter, {
    sessionExpiresIn: new TimeSpan(14, "d"),
    sessionCookie: {
      name: "cw_session",
      // `secure` is decided per request from the protocol (see session.ts).
      attributes: { sameSite: "lax", secure: false },
    },
    getUserAttributes: (a) => ({
      email: a.email,
      name: a.name,
      role: a.role,
      customerId: a.customerId,
      active: Boolean(a.active),
    }),
  });
}

export type AppLucia = ReturnType<typeof createLucia>;

declare module "lucia" {
  interface Register {
    Lucia: AppLucia;
    DatabaseUserAttributes: {
      email: string;
      name: string;
      role: Role;
      customerId: number | null;
      active: number | boolean;
    };
  }
}
