import type { ErrorCode } from "../../shared/api/error";

/** An error a service throws on purpose; the error handler turns it into `{ error: { code, message, fields? } }`. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly fields?: Record<string, string>,
    /** More of the error body, beside code and message (a version conflict carries the current record). */
    readonly extra?: Record<string, unknown>,
  ) {
    super(message);
    this.name = "HttpError";
  }
}

export const badRequest = (message: string, fields?: Record<string, string>) =>
  new HttpError(400, fields ? "validation_failed" : "bad_request", message, fields);
export const unauthenticated = (message = "Sign in to continue") => new HttpError(401, "unauthenticated", message);
export const forbidden = (message = "Your role does not allow this") => new HttpError(403, "forbidden", message);
export const notFound = (what = "Record") => new HttpError(404, "not_found", `${what} not found`);
export const conflict = (message: string, fields?: Record<string, string>) => new HttpError(409, "conflict", message, fields);

/**
 * An edit named a version that is no longer the record's: someone saved it in between. The body carries the record
 * as it is now and who saved it when, so the screen can show them and keep what this user typed.
 */
export const versionConflict = (what: string, current: unknown, changedBy: string | null, changedAt: number | null) =>
  new HttpError(
    409,
    "version_conflict",
    `${changedBy ?? "Someone"} changed this ${what}${changedAt ? ` at ${new Date(changedAt).toISOString()}` : ""} after you opened it, so your changes were not saved.`,
    undefined,
    { current, changedBy, changedAt: changedAt == null ? null : new Date(changedAt).toISOString() },
  );

/** The disk under the database or the uploads is full: nothing of the request was kept. */
export const storageFull = () =>
  new HttpError(
    507,
    "storage_full",
    "The server's disk is full, so this was not saved (nothing of it was kept). Free space on the machine that runs Coatwright, or ask whoever looks after it, then try again.",
  );

/** A database or file-system error that means "no space left": SQLite's SQLITE_FULL, or ENOSPC/EDQUOT from a file write. */
export function isStorageFull(err: unknown): boolean {
  const code = (err as { code?: unknown } | null)?.code;
  return code === "SQLITE_FULL" || code === "ENOSPC" || code === "EDQUOT";
}
