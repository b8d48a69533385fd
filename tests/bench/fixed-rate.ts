import http from "node:http";

export type FixedRateResult = { route: string; ratePerSec: number; sent: number; p50Ms: number; p99Ms: number; maxMs: number; errors: number; non2xx: number };

/**
 * An open-loop load at a fixed rate, as a shop really loads the server: request i is due at start + i / rate whether
 * or not earlier answers have come back, and its latency is measured from that due time, not from when it could be
 * sent. A closed loop (autocannon's connections, each waiting for its answer) stops sending while the server stalls
 * and so leaves the slow moments out of its percentiles ("coordinated omission", G. Tene; wrk2 measures the same way
 * as here). Connections are opened as needed (a keep-alive agent with no socket cap), so a slow answer never holds up the next request.
 * `next(i)` gives request i: its path, method, headers and body.
 */
export async function fixedRate(
  route: string,
  baseUrl: string,
  ratePerSec: number,
  seconds: number,
  next: (i: number) => { path: string; method?: "GET" | "POST"; headers?: Record<string, string>; body?: string },
  warmupSeconds = 2,
): Promise<FixedRateResult> {
  const agent = new http.Agent({ keepAlive: true, maxSockets: Infinity });
  const total = Math.round(ratePerSec * (warmupSeconds + seconds));
  const warm = Math.round(ratePerSec * warmupSeconds);
  const latencies: number[] = [];
  let errors = 0;
  let non2xx = 0;
  const start = performance.now() + 50;
  const inFlight: Promise<void>[] = [];
  for (let i = 0; i < total; i++) {
    const due = start + (i * 1000) / ratePerSec;
    const wait = due - performance.now();
    if (wait > 1) await new Promise((r) => setTimeout(r, wait));
    const req = next(i);
    inFlight.push(
      send(agent, baseUrl + req.path, req.method ?? "GET", req.headers ?? {}, req.body)
        .then((status) => {
          if (i >= warm) {
            latencies.push(performance.now() - due);
            if (status < 200 || status >= 300) non2xx++;
          }
        })
        .catch(() => {
          if (i >= warm) errors++;
        }),
    );
  }
  await Promise.all(inFlight);
  agent.destroy();
  latencies.sort((a, b) => a - b);
  const at = (q: number) => Math.round((latencies[Math.min(latencies.length - 1, Math.floor(q * latencies.length))] ?? 0) * 10) / 10;
  return { route, ratePerSec, sent: total - warm, p50Ms: at(0.5), p99Ms: at(0.99), maxMs: at(1), errors, non2xx };
}

/** One request on the keep-alive agent; resolves with the status once the whole answer has arrived. */
function send(agent: http.Agent, url: string, method: string, headers: Record<string, string>, body?: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const req = http.request(url, { method, headers: body ? { ...headers, "content-length": Buffer.byteLength(body) } : headers, agent }, (res) => {
      res.on("data", () => {});
      res.on("end", () => resolve(res.statusCode ?? 0));
      res.on("error", reject);
    });
    req.on("error", reject);
    req.end(body);
  });
}
