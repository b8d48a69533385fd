import { createServer, type RequestListener, type ServerResponse } from "node:http";
import { randomUUID } from "node:crypto";
import type { AddressInfo } from "node:net";

/** Why the port could not be taken, in words an owner can act on. */
export class PortError extends Error {}

function portProblem(err: NodeJS.ErrnoException, port: number): PortError {
  if (err.code === "EADDRINUSE")
    return new PortError(`Port ${port} is already in use (another Coatwright, or another program, is listening on it). Stop that program or set PORT to a free port.`);
  if (err.code === "EACCES") return new PortError(`Not allowed to listen on port ${port}: ports below 1024 need special rights. Set PORT to 1024 or above.`);
  return new PortError(`Could not listen on port ${port}: ${err.message}`);
}

/**
 * The HTTP server, bound before anything else happens, so a port that is taken stops the start before the database
 * is opened. Until `serve(app)` it answers 503 "starting". `close(graceMs)` stops taking connections, lets the
 * requests in flight finish (each answer then closes its connection), and after `graceMs` cuts whatever is left.
 */
export function bindPort(port: number): Promise<ReturnType<typeof wrap>> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    const onError = (err: NodeJS.ErrnoException) => reject(portProblem(err, port));
    server.once("error", onError);
    server.listen(port, () => {
      server.off("error", onError);
      resolve(wrap(server));
    });
  });
}

function wrap(server: ReturnType<typeof createServer>) {
  const inFlight = new Set<ServerResponse>();
  let closing = false;
  let handler: RequestListener | null = null;
  let onDrained: (() => void) | null = null;

  server.on("request", (req, res) => {
    inFlight.add(res);
    if (closing) res.setHeader("Connection", "close");
    res.once("close", () => {
      inFlight.delete(res);
      if (inFlight.size === 0) onDrained?.();
    });
    if (handler) return handler(req, res);
    res.writeHead(503, { "Content-Type": "application/json", "Retry-After": "2", "X-Request-Id": randomUUID(), "Cache-Control": "no-store" });
    res.end(JSON.stringify({ error: { code: "starting", message: "Coatwright is starting; try again in a moment." } }));
  });

  return {
    server,
    port: (server.address() as AddressInfo).port,
    serve(app: RequestListener) {
      handler = app;
    },
    inFlight: () => inFlight.size,
    async close(graceMs: number): Promise<{ cut: number }> {
      closing = true;
      for (const res of inFlight) if (!res.headersSent) res.setHeader("Connection", "close");
      const closed = new Promise<void>((r) => server.close(() => r()));
      server.closeIdleConnections();
      if (inFlight.size > 0) {
        let timer: NodeJS.Timeout | undefined;
        await Promise.race([
          new Promise<void>((r) => (onDrained = r)),
          new Promise<void>((r) => (timer = setTimeout(r, graceMs))),
        ]);
        clearTimeout(timer);
      }
      const cut = inFlight.size;
      server.closeIdleConnections();
      if (cut > 0) server.closeAllConnections();
      await Promise.race([closed, new Promise((r) => setTimeout(r, 1000).unref())]);
      return { cut };
    },
  };
}
export type BoundServer = ReturnType<typeof wrap>;
