import { afterEach, describe, expect, it } from "vitest";
import { createHash } from "node:crypto";
import { copyFileSync, existsSync, mkdtempSync, readFileSync, statSync } from "node:fs";
import { connect, createServer, type Server } from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";
import Database from "better-sqlite3";
import { migrateDb, openDb } from "../../server/db/client";
import { cleanUp, freePort, runTs, startServer, waitUp, type ServerProcess } from "../support/server-process";

let server: ServerProcess | undefined;
let blocker: Server | undefined;
afterEach(() => {
  cleanUp(server);
  blocker?.close();
});

const DEMO_EMAILS = ["owner", "estimator", "painter", "painter2", "customer"].map((n) => `${n}@demo.coatwright.test`);

type Outcome = { ok: true; status: number; at: number } | { ok: false; error: string; at: number };

describe("stopping with requests in flight", () => {
  it("SIGTERM with 40 sign-ins in flight: no new connections, all 40 answered, database closed, exit 0", async () => {
    const dataDir = mkdtempSync(path.join(tmpdir(), "cw-stop-"));
    // The grace time is raised from its 10 s so a busy test machine cannot turn slow sign-ins into cut ones (the
    // bound itself is the next test's subject).
    server = startServer({ PORT: String(await freePort()), DATA_DIR: dataDir, BACKUP_EVERY_HOURS: "0", SIGNIN_LIMIT_PER_ADDRESS: "1000", SHUTDOWN_GRACE_SECONDS: "30" });
    await waitUp(server);
    const { base } = server;

    // 40 sign-ins at once, each on its own connection; each is an argon2 verification (tens of ms of work).
    let signalledAt = Infinity;
    let firstAnswer: () => void;
    const answered = new Promise<void>((r) => (firstAnswer = r));
    const attempts: Promise<Outcome>[] = Array.from({ length: 40 }, (_, i) =>
      fetch(`${base}/api/auth/sign-in`, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ email: DEMO_EMAILS[i % DEMO_EMAILS.length], password: "paintshop-demo" }),
      }).then(
        async (res) => {
          await res.arrayBuffer();
          firstAnswer();
          return { ok: true as const, status: res.status, at: Date.now() };
        },
        (err: Error & { cause?: { code?: string } }) => ({ ok: false as const, error: err.cause?.code ?? err.message, at: Date.now() }),
      ),
    );
    // Stop the moment the first answer is back: the other sign-ins are still being worked on.
    await answered;
    server.proc.kill("SIGTERM");
    signalledAt = Date.now();
    // Once the server has stopped listening, a new connection is refused.
    for (let waited = 0; waited < 5000 && !server.stdout().includes("No longer accepting connections"); waited += 5) await new Promise((r) => setTimeout(r, 5));
    const late = await new Promise<string>((resolve) => {
      const socket = connect(Number(new URL(base).port), "127.0.0.1");
      socket.once("connect", () => (socket.destroy(), resolve("connected")));
      socket.once("error", (err: NodeJS.ErrnoException) => resolve(err.code ?? err.message));
    });

    const outcomes = await Promise.all(attempts);
    const exit = await server.exited;
    const stoppedIn = Date.now() - signalledAt;

    const failures = outcomes.filter((o) => !o.ok);
    expect(failures, JSON.stringify(failures.slice(0, 3))).toEqual([]);
    expect(outcomes.map((o) => (o.ok ? o.status : 0))).toEqual(Array(40).fill(200));
    // The test did what it says: many sign-ins were answered after the signal.
    expect(outcomes.filter((o) => o.at >= signalledAt).length).toBeGreaterThanOrEqual(10);
    expect(late).toBe("ECONNREFUSED");
    expect(exit).toEqual({ code: 0, signal: null });
    expect(stoppedIn).toBeLessThan(30_000);
    expect(server.stdout()).not.toMatch(/"cut":/);
    // Closed cleanly: SQLite folded the WAL back in and removed it, and every sign-in's session is there.
    expect(existsSync(path.join(dataDir, "coatwright.db-wal"))).toBe(false);
    const db = new Database(path.join(dataDir, "coatwright.db"), { readonly: true });
    expect((db.prepare("select count(*) as n from sessions").get() as { n: number }).n).toBeGreaterThanOrEqual(40);
    expect(db.pragma("integrity_check", { simple: true })).toBe("ok");
    db.close();
    expect(server.stdout()).toContain('"msg":"Stopped"');
  }, 90_000);

  it("waits no longer than SHUTDOWN_GRACE_SECONDS for a request that never finishes, then exits 0", async () => {
    const dataDir = mkdtempSync(path.join(tmpdir(), "cw-stop-grace-"));
    const port = await freePort();
    server = startServer({ PORT: String(port), DATA_DIR: dataDir, BACKUP_EVERY_HOURS: "0", SHUTDOWN_GRACE_SECONDS: "2" });
    await waitUp(server);
    // A client that sends its headers and then never the body it promised.
    const stuck = connect(port, "127.0.0.1");
    await new Promise((r) => stuck.once("connect", r));
    stuck.write("POST /api/auth/sign-in HTTP/1.1\r\nHost: localhost\r\nContent-Type: application/json\r\nContent-Length: 500\r\n\r\n{");
    const closedByServer = new Promise<number>((r) => stuck.once("close", () => r(Date.now())));
    await new Promise((r) => setTimeout(r, 300));

    const signalledAt = Date.now();
    server.proc.kill("SIGTERM");
    const exit = await server.exited;
    const took = Date.now() - signalledAt;
    expect(exit).toEqual({ code: 0, signal: null });
    expect(took).toBeGreaterThanOrEqual(2000);
    expect(took).toBeLessThan(6000);
    expect((await closedByServer) - signalledAt).toBeGreaterThanOrEqual(1900);
    expect(server.stdout()).toMatch(/"cut":1/);
  }, 60_000);
});

describe("starting on a port that is taken", () => {
  async function takenPort() {
    const port = await freePort();
    blocker = createServer(() => undefined);
    await new Promise<void>((r) => blocker!.listen(port, r));
    return port;
  }

  it("says the port is in use and exits non-zero before creating the data folder or the database", async () => {
    const port = await takenPort();
    const dataDir = path.join(mkdtempSync(path.join(tmpdir(), "cw-port-")), "data");
    server = startServer({ PORT: String(port), DATA_DIR: dataDir });
    const exit = await server.exited;
    expect(exit.code).toBe(1);
    expect(server.stderr()).toContain(`Port ${port} is already in use`);
    expect(server.stdout()).toContain(`Port ${port} is already in use`);
    expect(existsSync(dataDir)).toBe(false);
  }, 60_000);

  it("leaves an existing database exactly as it was", async () => {
    const port = await takenPort();
    const dataDir = mkdtempSync(path.join(tmpdir(), "cw-port-existing-"));
    const made = openDb(path.join(dataDir, "made.db"));
    migrateDb(made);
    made.$client.pragma("wal_checkpoint(TRUNCATE)");
    made.$client.close();
    const dbFile = path.join(dataDir, "coatwright.db");
    copyFileSync(path.join(dataDir, "made.db"), dbFile);
    const hash = () => createHash("sha256").update(readFileSync(dbFile)).digest("hex");
    const before = { hash: hash(), mtime: statSync(dbFile).mtimeMs };

    server = startServer({ PORT: String(port), DATA_DIR: dataDir });
    expect((await server.exited).code).toBe(1);
    expect({ hash: hash(), mtime: statSync(dbFile).mtimeMs }).toEqual(before);
    for (const extra of ["coatwright.db-wal", "coatwright.db-shm", "secret", "uploads", "backups"]) expect(existsSync(path.join(dataDir, extra)), extra).toBe(false);
  }, 60_000);

  it("says what is wrong with a bad setting instead of a stack trace", async () => {
    const dataDir = path.join(mkdtempSync(path.join(tmpdir(), "cw-badenv-")), "data");
    const run = runTs("server/index.ts", { PORT: String(await freePort()), DATA_DIR: dataDir, BACKUP_KEEP: "0" });
    server = { ...run, base: "" }; // stopped after the test if it did not exit by itself
    expect((await run.exited).code).toBe(1);
    expect(run.stderr()).toMatch(/BACKUP_KEEP: BACKUP_KEEP must keep at least one backup/);
    expect(run.stderr()).not.toMatch(/\n\s+at /);
    expect(existsSync(dataDir)).toBe(false);
  }, 60_000);
});
