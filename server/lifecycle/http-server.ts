import { createServer, type RequestListener, type ServerResponse } from "node:http";
import { Server as NetServer, type AddressInfo, type Socket } from "node:net";
import { randomUUID } from "node:crypto";

/** Why the port could not be taken, in words an owner can act on. */
export class PortError extends Error {}

function portProblem(err: NodeJS.ErrnoException, port: number): PortError {
  if (err.code === "EADDRINUSE")
    return new PortError(`Port ${port} is already in use (another Coatwright, or another program, is listening on it). Stop that program or set PORT to a free port.`);
  if (err.code === "EACCES") return new PortError(`Not allowed to listen on port ${port}: ports below 1024 need special rights. Set PORT to 1024 or above.`);
  return new PortError(`Could not listen on port ${port}: ${err.message}`);
}

/** How long a connection accepted before the stop may take to send its request. */
const FRESH_CONNECTION_MS = 1000;
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const nextTurn = () => new Promise((r) => setImmediate(r));

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
  /** Connections that have not sent a request yet. */
  const fresh = new Set<Socket>();
  let closing = false;
  let handler: RequestListener | null = null;

  let accepted = 0;
  server.on("connection", (socket: Socket) => {
    accepted++;
    fresh.add(socket);
    socket.once("close", () => fresh.delete(socket));
  });
  server.on("request", (req, res) => {
    fresh.delete(req.socket);
    inFlight.add(res);
    if (closing) res.setHeader("Connection", "close");
    res.once("close", () => inFlight.delete(res));
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
    async close(graceMs: number, onListenerClosed?: () => void): Promise<{ cut: number }> {
      closing = true;
      const started = Date.now();
      for (const res of inFlight) if (!res.headersSent) res.setHeader("Connection", "close");
      // Connections the system has already completed but the server has not picked up yet would be reset when the
      // listening socket closes, and a busy server picks them up a few per turn of its event loop. So the listener
      // closes only after a turn in which none was waiting (a turn with one waiting always takes at least one).
      await nextTurn();
      for (let turns = 0; turns < 100_000; turns++) {
        const before = accepted;
        await nextTurn();
        if (accepted === before) break;
      }
      // Stop listening. (http.Server's own close() would also drop every connection without a request in progress,
      // including ones accepted a moment ago whose request is still on its way: those clients would see a reset.)
      const closed = new Promise<void>((r) => NetServer.prototype.close.call(server, () => r()));
      onListenerClosed?.();
      // Wait for the requests in flight, and give connections already accepted a moment to send theirs.
      while (Date.now() - started < graceMs && (inFlight.size > 0 || (fresh.size > 0 && Date.now() - started < FRESH_CONNECTION_MS))) await sleep(20);
      const cut = inFlight.size;
      server.closeIdleConnections();
      if (cut > 0) server.closeAllConnections();
      await Promise.race([closed, sleep(1000)]);
      return { cut };
    },
  };
}
export type BoundServer = ReturnType<typeof wrap>;
