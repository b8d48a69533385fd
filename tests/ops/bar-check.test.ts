import { afterEach, describe, expect, it } from "vitest";
import { existsSync, mkdtempSync, readdirSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import Database from "better-sqlite3";
import { cleanUp, freePort, startServer, waitUp, type ServerProcess } from "../support/server-process";

/**
 * The check an outsider can run against the real server: started with BACKUP_EVERY_HOURS=0.001 (3.6 s) and a
 * temporary BACKUP_DIR, within 15 s a backup exists that passes PRAGMA integrity_check, and every response carries
 * X-Request-Id.
 */
let server: ServerProcess | undefined;
afterEach(() => cleanUp(server));

/** Complete backups (the .partial folder of one being written does not count) whose database passes the check. */
function checkedBackups(dir: string): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir).filter((name) => {
    const file = path.join(dir, name, "coatwright.db");
    if (name.endsWith(".partial") || !existsSync(path.join(dir, name, "backup.json")) || !existsSync(file)) return false;
    const db = new Database(file, { readonly: true, fileMustExist: true });
    try {
      return db.pragma("integrity_check", { simple: true }) === "ok";
    } finally {
      db.close();
    }
  });
}

describe("the bar check", () => {
  it("backs up within 15 s of starting, the backup passes integrity_check, and every response carries X-Request-Id", async () => {
    const dataDir = mkdtempSync(path.join(tmpdir(), "cw-bar-"));
    const backupDir = mkdtempSync(path.join(tmpdir(), "cw-bar-backups-"));
    const started = Date.now();
    server = startServer({ PORT: String(await freePort()), DATA_DIR: dataDir, BACKUP_DIR: backupDir, BACKUP_EVERY_HOURS: "0.001", SIGNIN_LIMIT_PER_ADDRESS: "1000" });

    let first: string[] = [];
    while (Date.now() - started < 15_000 && first.length === 0) {
      await new Promise((r) => setTimeout(r, 200));
      first = checkedBackups(backupDir);
    }
    expect(first.length, `no checked backup in ${backupDir} within 15 s`).toBeGreaterThan(0);
    expect(Date.now() - started).toBeLessThan(15_000);

    // Every kind of answer carries the id: health, sign-in (refused and accepted), a guarded read, an unknown route,
    // a bad body, a page outside the API.
    await waitUp(server);
    const { base } = server;
    const json = { "content-type": "application/json" };
    const answers = [
      await fetch(`${base}/api/health`),
      await fetch(`${base}/api/auth/sign-in`, { method: "POST", headers: json, body: JSON.stringify({ email: "owner@demo.coatwright.test", password: "not-the-password" }) }),
      await fetch(`${base}/api/auth/sign-in`, { method: "POST", headers: json, body: JSON.stringify({ email: "owner@demo.coatwright.test", password: "paintshop-demo" }) }),
      await fetch(`${base}/api/jobs`),
      await fetch(`${base}/api/no-such-thing`),
      await fetch(`${base}/api/auth/sign-in`, { method: "POST", headers: json, body: "{broken" }),
      await fetch(`${base}/some/page`),
    ];
    const cookie = answers[2]!.headers.getSetCookie()[0]!.split(";")[0]!;
    answers.push(await fetch(`${base}/api/jobs?page=1`, { headers: { cookie } }), await fetch(`${base}/api/dashboard`, { headers: { cookie } }));
    expect(answers.map((r) => r.status)).toEqual([200, 401, 200, 401, 404, 400, expect.any(Number), 200, 200]);
    const ids = answers.map((r) => r.headers.get("x-request-id"));
    for (const id of ids) expect(id).toMatch(/^[0-9a-f-]{36}$/);
    expect(new Set(ids).size).toBe(ids.length);

    // The schedule goes on (every 3.6 s), and the owner's dashboard shows the newest backup.
    const dash = (await answers.at(-1)!.json()) as { system: { backups: { last: { takenAt: string } | null; lastFailure: unknown } } };
    expect(dash.system.backups.last).not.toBeNull();
    expect(dash.system.backups.lastFailure).toBeNull();
    await new Promise((r) => setTimeout(r, 4500));
    expect(checkedBackups(backupDir).length).toBeGreaterThan(first.length);

    // The log has a line per request with its id, and neither the password nor the session cookie.
    server.proc.kill("SIGTERM");
    expect((await server.exited).code).toBe(0);
    const log = server.stdout();
    for (const id of ids) expect(log).toContain(`"requestId":"${id}"`);
    expect(log).not.toContain("paintshop-demo");
    expect(log).not.toContain("not-the-password");
    expect(log).not.toContain(cookie.split("=")[1]!);
  }, 60_000);
});
