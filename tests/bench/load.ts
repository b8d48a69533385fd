import autocannon from "autocannon";
import type { SprayJob } from "./seed/shop";
import type { Child } from "./servers/processes";

export const LOAD = {
  connections: 50,
  warmupSeconds: Number(process.env.BENCH_WARMUP ?? 2),
  seconds: Number(process.env.BENCH_SECONDS ?? 10),
};

export type LoadResult = {
  reqPerSec: number;
  p50Ms: number;
  p99Ms: number;
  errors: number;
  non2xx: number;
  /** How many answers of each non-2xx status (so a failed run says why). */
  non2xxByStatus: Record<string, number>;
  requests: number;
  cpuUsPerRequest: number;
};
type Run = { requests: number; seconds: number; latencies: number[]; errors: number; non2xx: number; statuses: Record<string, number>; cpuUs: number; allRequests: number };

/**
 * One autocannon run; every response's latency is kept so runs can be merged. With `skipSeconds`, requests sent in
 * the first seconds of the run are a warm-up on the same connections and are left out of the figures.
 */
export function run(server: Child, opts: autocannon.Options, skipSeconds = 0): Promise<Run> {
  const latencies: number[] = [];
  const statuses: Record<string, number> = {};
  const started = performance.now();
  const cpuBefore = server.cpuMs();
  return new Promise((resolve, reject) => {
    const instance = autocannon({ connections: LOAD.connections, ...opts }, (err, r) =>
      err
        ? reject(err)
        : resolve({
            requests: latencies.length,
            seconds: r.duration - skipSeconds,
            latencies,
            errors: r.errors + r.timeouts,
            non2xx: r.non2xx,
            statuses,
            cpuUs: (server.cpuMs() - cpuBefore) * 1000,
            allRequests: r.requests.total,
          }),
    );
    instance.on("response", (_client, status, _bytes, ms) => {
      if (status < 200 || status >= 300) statuses[status] = (statuses[status] ?? 0) + 1;
      if (performance.now() - ms - started >= skipSeconds * 1000) latencies.push(ms);
    });
  });
}

export function merge(runs: Run[]): LoadResult {
  const latencies = runs.flatMap((r) => r.latencies).sort((a, b) => a - b);
  const at = (q: number) => Math.round(latencies[Math.min(latencies.length - 1, Math.floor(q * latencies.length))] ?? 0);
  const requests = runs.reduce((n, r) => n + r.requests, 0);
  return {
    reqPerSec: Math.round(requests / runs.reduce((n, r) => n + r.seconds, 0)),
    p50Ms: at(0.5),
    p99Ms: at(0.99),
    errors: runs.reduce((n, r) => n + r.errors, 0),
    non2xx: runs.reduce((n, r) => n + r.non2xx, 0),
    non2xxByStatus: runs.reduce<Record<string, number>>((all, r) => {
      for (const [k, v] of Object.entries(r.statuses)) all[k] = (all[k] ?? 0) + v;
      return all;
    }, {}),
    requests,
    // Server CPU per answered request over whole runs (warm-up included): less swayed by other load on the machine.
    cpuUsPerRequest: Math.round(runs.reduce((n, r) => n + r.cpuUs, 0) / runs.reduce((n, r) => n + r.allRequests, 0)),
  };
}

/**
 * GET `path` on the real app and on the baseline, 50 connections each, one after the other, in four slices taken in
 * turn (app, baseline, app, baseline, ...) so that bursts of other work on the machine fall on both alike. Each slice
 * warms up its own connections (LOAD.warmupSeconds the first time, 1 s after) before its measured part.
 */
export async function compareGet(appServer: Child, baselineServer: Child, path: string, cookie: string) {
  const slices = 4;
  const measure = (server: Child, warmup: number) =>
    run(server, { url: server.url + path, duration: warmup + LOAD.seconds / slices, headers: { cookie } }, warmup);
  const app: Run[] = [];
  const bare: Run[] = [];
  for (let slice = 0; slice < slices; slice++) {
    const warmup = slice === 0 ? LOAD.warmupSeconds : 1;
    app.push(await measure(appServer, warmup));
    bare.push(await measure(baselineServer, warmup));
  }
  return { app: merge(app), baseline: merge(bare) };
}

/** A write request: its path and JSON body. */
export type WriteRequest = { path: string; body: string };

/**
 * POST at 50 connections, each request taken from `next()` (a coat not yet logged, a sheet not yet recorded), so
 * every request is a valid write. `seconds` measured after `warmup` seconds on the same connections.
 */
export function writeLoad(server: Child, cookie: string, next: () => WriteRequest, seconds: number, warmup: number, maxRequests: number): Promise<Run> {
  const headers = { cookie, "content-type": "application/json" };
  return run(
    server,
    {
      url: server.url,
      duration: warmup + seconds,
      maxOverallRequests: maxRequests,
      setupClient: (client) => {
        client.setRequests([{ method: "POST", path: "/", headers, setupRequest: (req) => ({ ...req, ...next() }) }]);
      },
    },
    warmup,
  );
}

/**
 * A write route on the real app and on the bare baseline (the same statements in one transaction), in alternating
 * slices like compareGet. The app takes a fresh write from `next()` each time; the baseline replays its one request.
 */
export async function compareWrite(appServer: Child, baselineServer: Child, next: () => WriteRequest, baselineRequest: () => WriteRequest, cookie: string, budget: number) {
  const slices = 4;
  const app: Run[] = [];
  const bare: Run[] = [];
  for (let slice = 0; slice < slices; slice++) {
    const warmup = slice === 0 ? LOAD.warmupSeconds : 1;
    app.push(await writeLoad(appServer, cookie, next, LOAD.seconds / slices, warmup, Math.floor(budget / slices)));
    // Both write the same database file: let the last answers of one finish before the other starts.
    await new Promise((r) => setTimeout(r, 500));
    bare.push(await writeLoad(baselineServer, cookie, baselineRequest, LOAD.seconds / slices, warmup, 10_000_000));
    await new Promise((r) => setTimeout(r, 500));
  }
  return { app: merge(app), baseline: merge(bare) };
}

/** The load sprays coats back to back, inside their flash times: each says so, as a painter would have to. */
export const LOAD_REASON = "Load test: coats back to back";

/** Every coat of the pool's jobs, in the order each job's booth card asks for them; `next()` hands out the next one. */
export function coatQueue(pool: SprayJob[]) {
  // Round-robin over the jobs: a job's next coat comes many requests later, so two connections never race for one job.
  const byJob = pool.map((j) => ({ jobId: j.jobId, coats: [...j.coats] }));
  let i = 0;
  const left = () => byJob.reduce((n, j) => n + j.coats.length, 0);
  const next = (): WriteRequest => {
    for (let tries = 0; tries < byJob.length; tries++) {
      const job = byJob[i++ % byJob.length]!;
      const coat = job.coats.shift();
      if (coat) return { path: "/api/coat-logs", body: JSON.stringify({ jobId: job.jobId, ...coat, boothTemp: 21, tempUnit: "C", humidityPct: 48, timingOverrideReason: LOAD_REASON }) };
    }
    throw new Error("the spray pool ran dry");
  };
  return { next, left };
}
