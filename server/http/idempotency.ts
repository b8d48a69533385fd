import { createHash } from "node:crypto";
import type { Request, RequestHandler, Response } from "express";
import { and, eq, lt } from "drizzle-orm";
import type { AppDeps } from "../deps";
import { idempotencyKeys } from "../db/schema";
import { actorOf } from "./guard";
import { badRequest, conflict, HttpError } from "./http-error";
import { IDEMPOTENCY_HEADER, IDEMPOTENCY_KEEP_DAYS, IDEMPOTENCY_KEY_PATTERN } from "../../shared/api/idempotency";

/** A first request still in hand after this long is taken to have died with its process; a repeat may take it over. */
const PENDING_TAKEOVER_MS = 60_000;
const DAY_MS = 24 * 60 * 60 * 1000;

/** JSON with object keys sorted, so two bodies that differ only in key order have the same fingerprint. */
function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(",")}]`;
  if (value && typeof value === "object")
    return `{${Object.keys(value)
      .sort()
      .map((k) => `${JSON.stringify(k)}:${canonical((value as Record<string, unknown>)[k])}`)
      .join(",")}}`;
  return JSON.stringify(value ?? null);
}

function fingerprintOf(req: Request): string {
  const hash = createHash("sha256").update(`${req.method} ${req.baseUrl}${req.path}\n${canonical(req.body ?? {})}`);
  if (req.file) hash.update("\nfile:").update(req.file.buffer);
  return hash.digest("hex");
}

const keyField = (message: string) => ({ [IDEMPOTENCY_HEADER]: message });

/**
 * Makes a write safe to repeat: with an `Idempotency-Key` header, the first successful answer is stored under the key
 * and the signed-in user, and a repeat of the key gets that answer back (status and body, with
 * `Idempotent-Replayed: true`) without running the write again. The same key with a different request is refused
 * with 422 naming the header. Without the header the route works as before. Goes after the route's guard (and after
 * the upload parser on a file route, so the file is part of the fingerprint).
 */
export function idempotent(deps: AppDeps): RequestHandler {
  return (req, res, next) => {
    const key = req.get(IDEMPOTENCY_HEADER);
    if (key === undefined) return next();
    if (!IDEMPOTENCY_KEY_PATTERN.test(key))
      return next(badRequest(`The ${IDEMPOTENCY_HEADER} header must be 8 to 128 letters, digits or - _ : . (a UUID fits)`, keyField("Not a valid key")));
    const userId = actorOf(res).id;
    const fingerprint = fingerprintOf(req);
    const now = deps.now();
    const where = and(eq(idempotencyKeys.key, key), eq(idempotencyKeys.userId, userId));
    const claim = deps.db.transaction((tx) => {
      const row = tx.select().from(idempotencyKeys).where(where).get();
      if (row) {
        if (row.fingerprint !== fingerprint)
          return new HttpError(
            422,
            "idempotency_key_reused",
            `This ${IDEMPOTENCY_HEADER} was already used for a different request; send a new key for a new entry`,
            keyField("Already used for a different request"),
          );
        if (row.status != null) return row;
        if (now - row.createdAt < PENDING_TAKEOVER_MS)
          return conflict("The first request with this key is still being handled; try again in a moment", keyField("Still being handled"));
        tx.delete(idempotencyKeys).where(where).run();
      }
      tx.delete(idempotencyKeys).where(lt(idempotencyKeys.createdAt, now - IDEMPOTENCY_KEEP_DAYS * DAY_MS)).run();
      tx.insert(idempotencyKeys).values({ key, userId, method: req.method, path: `${req.baseUrl}${req.path}`, fingerprint, createdAt: now }).run();
      return null;
    });
    if (claim instanceof Error) return next(claim);
    if (claim) {
      res.status(claim.status!).set("Idempotent-Replayed", "true").json(JSON.parse(claim.response ?? "null"));
      return;
    }
    keepFirstAnswer(deps, res, where);
    next();
  };
}

type Claim = { where: ReturnType<typeof and>; stored: boolean };
/** The key each request in hand has claimed (none without the header). */
const claims = new WeakMap<Response, Claim>();

const storeAnswer = (deps: AppDeps, claim: Claim, status: number, body: unknown) =>
  deps.db.update(idempotencyKeys).set({ status, response: JSON.stringify(body ?? null) }).where(claim.where).run();

/**
 * Runs a route's write and, when the request claimed an `Idempotency-Key`, stores the answer (`status`, the write's
 * result) under the key in the same transaction: the record and its key commit together or not at all, so a crash in
 * between can never leave a record that a replay would write again. The route then sends the result with `status`.
 */
export function withAnswer<T>(deps: AppDeps, res: Response, status: number, write: () => T): T {
  const claim = claims.get(res);
  if (!claim) return write();
  return deps.db.transaction(() => {
    const result = write();
    storeAnswer(deps, claim, status, result);
    claim.stored = true;
    return result;
  });
}

/**
 * As the answer is sent: a failure frees the key for another try. A success was normally stored with its write
 * (withAnswer); a route that does not use it has its answer stored here, after the write (not crash-safe).
 */
function keepFirstAnswer(deps: AppDeps, res: Response, where: ReturnType<typeof and>) {
  const claim: Claim = { where, stored: false };
  claims.set(res, claim);
  let settled = false;
  const json = res.json.bind(res);
  res.json = (body: unknown) => {
    if (!settled) {
      settled = true;
      if (res.statusCode < 200 || res.statusCode >= 300) deps.db.delete(idempotencyKeys).where(where).run();
      else if (!claim.stored) storeAnswer(deps, claim, res.statusCode, body);
    }
    return json(body);
  };
  res.on("close", () => {
    if (!settled) {
      settled = true;
      if (!claim.stored) deps.db.delete(idempotencyKeys).where(where).run();
    }
  });
}
