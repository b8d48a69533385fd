/**
 * Crash safety: start the real server on a throwaway DATA_DIR, drive concurrent writes, kill it with SIGKILL
 * mid-load, then check that SQLite's integrity check passes and that every write the server acknowledged
 * with a 2xx is in the database. Repeats several rounds on the same data. Run: `npm run test:crash`.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import Database from "better-sqlite3";

const ROUNDS = Number(process.env.CRASH_ROUNDS ?? 4);
const WORKERS = 8;
const root = path.resolve(import.meta.dirname, "../..");
const dataDir = mkdtempSync(path.join(tmpdir(), "cw-crash-"));
const dbFile = path.join(dataDir, "coatwright.db");

type Ack = { kind: "job" | "item" | "stage"; id: number; detail: string };

function start(port: number): ChildProcess {
  return spawn(path.join(root, "node_modules/.bin/tsx"), ["server/index.ts"], {
    cwd: root,
    env: { ...process.env, PORT: String(port), DATA_DIR: dataDir, DEMO_MODE: "1" },
    stdio: ["ignore", "ignore", "inherit"],
    detached: true,
  });
}

async function waitUp(base: string) {
  for (let i = 0; i < 240; i++) {
    try {
      if ((await fetch(`${base}/api/health`)).ok) return;
    } catch {
      /* starting */
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error("server did not start");
}

async function signIn(base: string) {
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ email: "owner@demo.coatwright.test", password: "paintshop-demo" }),
  });
  if (!res.ok) throw new Error(`sign-in failed: ${res.status}`);
  return res.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
}

/** One worker: create a job, add an item, move it to quoted; remember every acknowledged write. */
async function worker(base: string, cookie: string, round: number, w: number, acks: Ack[], stop: { now: boolean }) {
  const post = (url: string, body: object) =>
    fetch(`${base}${url}`, { method: "POST", headers: { "content-type": "application/json", cookie }, body: JSON.stringify(body) });
  for (let n = 0; !stop.now; n++) {
    try {
      const title = `crash r${round} w${w} n${n}`;
      const job = await post("/api/jobs", { customerId: 1 + ((w + n) % 5), title });
      if (!job.ok) continue;
      const jobId = ((await job.json()) as { id: number }).id;
      acks.push({ kind: "job", id: jobId, detail: title });
      const item = await post(`/api/jobs/${jobId}/items`, { name: `part ${n}`, substrate: "steel", surfaceArea: 0.5, areaUnit: "m2" });
      if (item.ok) acks.push({ kind: "item", id: ((await item.json()) as { id: number }).id, detail: `job ${jobId}` });
      const stage = await post(`/api/jobs/${jobId}/stage`, { stage: "quoted" });
      if (stage.ok) acks.push({ kind: "stage", id: jobId, detail: "quoted" });
    } catch {
      return; // the server died under us: that is the point
    }
  }
}

function verify(acks: Ack[]) {
  const db = new Database(dbFile);
  try {
    const integrity = db.pragma("integrity_check", { simple: true });
    if (integrity !== "ok") throw new Error(`integrity_check: ${String(integrity)}`);
    const fk = db.pragma("foreign_key_check") as unknown[];
    if (fk.length) throw new Error(`foreign_key_check found ${fk.length} problems`);
    const job = db.prepare("select title, stage from jobs where id = ?");
    const item = db.prepare("select job_id from job_items where id = ?");
    const missing: Ack[] = [];
    for (const a of acks) {
      if (a.kind === "job" && (job.get(a.id) as { title: string } | undefined)?.title !== a.detail) missing.push(a);
      if (a.kind === "item" && !item.get(a.id)) missing.push(a);
      if (a.kind === "stage" && (job.get(a.id) as { stage: string } | undefined)?.stage === "inquiry") missing.push(a);
    }
    if (missing.length) throw new Error(`${missing.length} acknowledged writes are missing, e.g. ${JSON.stringify(missing.slice(0, 3))}`);
  } finally {
    db.close();
  }
}

let passed = 0;
let failed = 0;
for (let round = 1; round <= ROUNDS; round++) {
  const port = 5200 + Math.floor(Math.random() * 600);
  const base = `http://127.0.0.1:${port}`;
  const server = start(port);
  const acks: Ack[] = [];
  try {
    await waitUp(base);
    const cookie = await signIn(base);
    const stop = { now: false };
    const load = Array.from({ length: WORKERS }, (_, w) => worker(base, cookie, round, w, acks, stop));
    await new Promise((r) => setTimeout(r, 700 + Math.random() * 1300));
    process.kill(-server.pid!, "SIGKILL");
    stop.now = true;
    await Promise.all(load);
    await new Promise((r) => setTimeout(r, 200));
    verify(acks);
    passed++;
    console.log(`round ${round}: killed mid-load after ${acks.length} acknowledged writes; integrity ok, all present`);
  } catch (e) {
    failed++;
    console.error(`round ${round}: FAILED: ${(e as Error).message}`);
    try {
      process.kill(-server.pid!, "SIGKILL");
    } catch {
      /* already gone */
    }
  }
}
console.log(`crash check: ${passed} of ${ROUNDS} rounds passed`);
if (process.env.CRASH_SUMMARY) (await import("node:fs")).writeFileSync(process.env.CRASH_SUMMARY, JSON.stringify({ passed, failed }));
process.exit(failed ? 1 : 0);
