/**
 * Crash safety: start the real server on a throwaway DATA_DIR, drive concurrent writes (jobs, items, plans,
 * stage moves, mix sheets, coat logs), kill it with SIGKILL
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

type Ack = { kind: "job" | "item" | "stage" | "mixSheet" | "coat"; id: number; detail: string };

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

/**
 * One worker, over and over: create a job, add an item, give it a finish plan from a template, book it and
 * start prep, write a mix sheet for its first layer and log its first coats. Every 2xx is remembered.
 */
async function worker(base: string, cookie: string, templateId: number, round: number, w: number, acks: Ack[], stop: { now: boolean }) {
  const post = (url: string, body: object) =>
    fetch(`${base}${url}`, { method: "POST", headers: { "content-type": "application/json", cookie }, body: JSON.stringify(body) });
  const json = async <T>(res: Response) => (await res.json()) as T;
  for (let n = 0; !stop.now; n++) {
    try {
      const title = `crash r${round} w${w} n${n}`;
      const job = await post("/api/jobs", { customerId: 1 + ((w + n) % 5), title });
      if (!job.ok) continue;
      const jobId = (await json<{ id: number }>(job)).id;
      acks.push({ kind: "job", id: jobId, detail: title });
      const item = await post(`/api/jobs/${jobId}/items`, { name: `part ${n}`, substrate: "steel", surfaceArea: 0.5, areaUnit: "m2" });
      if (item.ok) acks.push({ kind: "item", id: (await json<{ id: number }>(item)).id, detail: `job ${jobId}` });
      if (!(await post(`/api/jobs/${jobId}/plan`, { fromPlanId: templateId })).ok) continue;
      if (!(await post(`/api/jobs/${jobId}/stage`, { stage: "booked" })).ok) continue;
      const prep = await post(`/api/jobs/${jobId}/stage`, { stage: "in_prep" });
      // The first coat moves the job on to the booth, so a later check accepts in_prep or in_booth.
      if (prep.ok) acks.push({ kind: "stage", id: jobId, detail: "in_prep" });
      const booth = await fetch(`${base}/api/jobs/${jobId}/booth`, { headers: { cookie } });
      if (!booth.ok) continue;
      const next = (await json<{ next: { state: string; layerId: number } }>(booth)).next;
      if (next.state !== "spray") continue;
      const sheet = await post("/api/mix-sheets", { jobId, layerId: next.layerId, mode: "total", amount: 250, unit: "mL" });
      if (sheet.ok) acks.push({ kind: "mixSheet", id: (await json<{ id: number }>(sheet)).id, detail: `job ${jobId}` });
      for (const coatNumber of [1, 2]) {
        const coat = await post("/api/coat-logs", { jobId, layerId: next.layerId, coatNumber, boothTemp: 21, tempUnit: "C", humidityPct: 45, prepOverrideReason: "Crash-safety load", timingOverrideReason: "Crash-safety load: coats back to back" });
        // The answer is the updated booth card; the coat is identified by job, layer and number.
        if (coat.ok) acks.push({ kind: "coat", id: jobId, detail: `${next.layerId}:${coatNumber}` });
      }
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
    const sheet = db.prepare("select job_id from mix_sheets where id = ?");
    const coat = db.prepare("select count(*) as n from coat_logs where job_id = ? and layer_id = ? and coat_number = ?");
    const missing: Ack[] = [];
    for (const a of acks) {
      if (a.kind === "job" && (job.get(a.id) as { title: string } | undefined)?.title !== a.detail) missing.push(a);
      if (a.kind === "item" && !item.get(a.id)) missing.push(a);
      if (a.kind === "stage" && !["in_prep", "in_booth"].includes((job.get(a.id) as { stage: string } | undefined)?.stage ?? "")) missing.push(a);
      if (a.kind === "mixSheet" && `job ${(sheet.get(a.id) as { job_id: number } | undefined)?.job_id}` !== a.detail) missing.push(a);
      if (a.kind === "coat" && (coat.get(a.id, ...a.detail.split(":").map(Number)) as { n: number }).n !== 1) missing.push(a);
    }
    if (missing.length) throw new Error(`${missing.length} acknowledged writes are missing, e.g. ${JSON.stringify(missing.slice(0, 3))}`);
  } finally {
    db.close();
  }
}

let passed = 0;
const seen = new Set<string>();
let failed = 0;
for (let round = 1; round <= ROUNDS; round++) {
  const port = 5200 + Math.floor(Math.random() * 600);
  const base = `http://127.0.0.1:${port}`;
  const server = start(port);
  const acks: Ack[] = [];
  try {
    await waitUp(base);
    const cookie = await signIn(base);
    const templates = (await (await fetch(`${base}/api/plans?kind=template`, { headers: { cookie } })).json()) as { items?: { id: number }[] } | { id: number }[];
    const templateId = (Array.isArray(templates) ? templates : templates.items ?? [])[0]!.id;
    const stop = { now: false };
    const load = Array.from({ length: WORKERS }, (_, w) => worker(base, cookie, templateId, round, w, acks, stop));
    await new Promise((r) => setTimeout(r, 1500 + Math.random() * 2000));
    process.kill(-server.pid!, "SIGKILL");
    stop.now = true;
    await Promise.all(load);
    await new Promise((r) => setTimeout(r, 200));
    verify(acks);
    const counts = new Map<string, number>();
    for (const a of acks) counts.set(a.kind, (counts.get(a.kind) ?? 0) + 1);
    const kinds = [...counts].map(([k, n]) => `${n} ${k}`).join(", ");
    for (const a of acks) seen.add(a.kind);
    console.log(`round ${round}: killed mid-load after ${acks.length} acknowledged writes (${kinds}); integrity ok, all present`);
    passed++;
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
// The load must really have reached every kind of write at least once over the rounds.
const unseen = ["job", "item", "stage", "mixSheet", "coat"].filter((k) => !seen.has(k));
if (unseen.length) {
  failed++;
  console.error(`no acknowledged ${unseen.join(", ")} writes in any round: the load did not exercise them`);
}
console.log(`crash check: ${passed} of ${ROUNDS} rounds passed`);
if (process.env.CRASH_SUMMARY) (await import("node:fs")).writeFileSync(process.env.CRASH_SUMMARY, JSON.stringify({ passed, failed }));
process.exit(failed ? 1 : 0);
