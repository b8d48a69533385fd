import { Lucia, TimeSpan } from "lucia";
import { DrizzleSQLiteAdapter } from "@lucia-auth/adapter-drizzle";
import type { Db } from "../db/client";
import { sessions, users } from "../db/schema";
import type { Role } from "../../shared/domain/roles";

export function createLucia(db: Db) {
  const adapter = new DrizzleSQLiteAdapter(db, sessions, users);
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
