import autocannon from "autocannon";
import type { SprayJob } from "./seed/shop";
import type { Child } from "./servers/processes";

export const LOAD = {
  connections: 50,
  warmupSeconds: Number(process.env.BENCH_WARMUP ?? 2),
  seconds: Number(process.env.BENCH_SECONDS ?? 10),
};

export type LoadResult = { reqPerSec: number; p50Ms: number; p99Ms: number; errors: number; non2xx: number; requests: number; cpuUsPerRequest: number };
type Run = { requests: number; seconds: number; latencies: number[]; errors: number; non2xx: number; cpuUs: number; allRequests: number };

/**
 * One autocannon run; every response's latency is kept so runs can be merged. With `skipSeconds`, requests sent in
 * the first seconds of the run are a warm-up on the same connections and are left out of the figures.
 */
function run(server: Child, opts: autocannon.Options, skipSeconds = 0): Promise<Run> {
  const latencies: number[] = [];
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
            cpuUs: (server.cpuMs() - cpuBefore) * 1000,
            allRequests: r.requests.total,
          }),
    );
    instance.on("response", (_client, _status, _bytes, ms) => {
      if (performance.now() - ms - started >= skipSeconds * 1000) latencies.push(ms);
    });
  });
}

function merge(runs: Run[]): LoadResult {
  const latencies = runs.flatMap((r) => r.latencies).sort((a, b) => a - b);
  const at = (q: number) => Math.round(latencies[Math.min(latencies.length - 1, Math.floor(q * latencies.length))] ?? 0);
  const requests = runs.reduce((n, r) => n + r.requests, 0);
  return {
    reqPerSec: Math.round(requests / runs.reduce((n, r) => n + r.seconds, 0)),
    p50Ms: at(0.5),
    p99Ms: at(0.99),
    errors: runs.reduce((n, r) => n + r.errors, 0),
    non2xx: runs.reduce((n, r) => n + r.non2xx, 0),
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

/**
 * POST one coat per request. Each connection takes a job of its own from the pool and logs its coats in order, so
 * every request is the coat the booth card shows next (valid, 201); then it takes the next job. The run stops before
 * the pool could run dry.
 */
export async function loadCoatLogs(server: Child, cookie: string, pool: SprayJob[]): Promise<LoadResult> {
  const queue = [...pool];
  const headers = { cookie, "content-type": "application/json" };
  const coatsLeft = () => queue.reduce((n, j) => n + j.coats.length, 0);
  const opts = (seconds: number): autocannon.Options => ({
    url: `${server.url}/api/coat-logs`,
    duration: seconds,
    // Jobs a connection has started are not in the queue: keep a whole job per connection in reserve.
    maxOverallRequests: Math.max(LOAD.connections, coatsLeft() - LOAD.connections * Math.max(...pool.map((j) => j.coats.length))),
    setupClient: (client) => {
      let job: SprayJob | undefined;
      let step = 0;
      const next = () => {
        if (!job || step === job.coats.length) {
          job = queue.shift();
          step = 0;
          if (!job) throw new Error("the spray pool ran dry");
        }
        return JSON.stringify({ jobId: job.jobId, ...job.coats[step++], boothTemp: 21, tempUnit: "C", humidityPct: 48 });
      };
      client.setRequests([{ method: "POST", path: "/api/coat-logs", headers, setupRequest: (req) => ({ ...req, body: next() }) }]);
    },
  });
  // One run: the first seconds warm up the same connections that are then measured. (A fresh connection's first
  // coat can wait behind the established ones for a second or two at this load; the report says so.)
  return merge([await run(server, opts(LOAD.warmupSeconds + LOAD.seconds), LOAD.warmupSeconds)]);
}
