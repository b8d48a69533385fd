import { spawn, type ChildProcess } from "node:child_process";
import { createServer } from "node:net";
import path from "node:path";

/**
 * The real server (`server/index.ts`, as `npm start` runs it after the build) in a child process of its own, so a
 * test can signal it, read what it printed and see how it exits.
 */
export const ROOT = path.resolve(import.meta.dirname, "../..");

export type ServerProcess = {
  proc: ChildProcess;
  base: string;
  stdout: () => string;
  stderr: () => string;
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
};

/** A port nobody is listening on now. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer().once("error", reject);
    probe.listen(0, "127.0.0.1", () => {
      const { port } = probe.address() as { port: number };
      probe.close(() => resolve(port));
    });
  });
}

/** Runs a TypeScript entry point of the project (server or script) with node + tsx, one process, no shell. */
export function runTs(script: string, env: Record<string, string>, args: string[] = []) {
  const proc = spawn(process.execPath, ["--import", "tsx", path.join(ROOT, script), ...args], {
    cwd: ROOT,
    env: { ...process.env, DEMO_MODE: "1", ...env },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let out = "";
  let err = "";
  proc.stdout!.on("data", (d) => (out += d));
  proc.stderr!.on("data", (d) => (err += d));
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) => proc.once("exit", (code, signal) => resolve({ code, signal })));
  return { proc, stdout: () => out, stderr: () => err, exited };
}

export function startServer(env: Record<string, string> & { PORT: string; DATA_DIR: string }): ServerProcess {
  return { ...runTs("server/index.ts", env), base: `http://127.0.0.1:${env.PORT}` };
}

/** Waits until /api/health answers 200 (the server answers 503 while it migrates and seeds). */
export async function waitUp(server: ServerProcess, ms = 60_000) {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    if (server.proc.exitCode !== null) throw new Error(`server exited (${server.proc.exitCode}): ${server.stderr()}`);
    try {
      if ((await fetch(`${server.base}/api/health`)).ok) return;
    } catch {
      /* not listening yet */
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`server did not come up within ${ms} ms: ${server.stderr()}`);
}

/** Signs in and returns the session cookie. */
export async function signIn(base: string, email: string, password = "paintshop-demo") {
  const res = await fetch(`${base}/api/auth/sign-in`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ email, password }) });
  if (!res.ok) throw new Error(`sign-in ${email}: ${res.status}`);
  return res.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
}

/** Stops a server still running at the end of a test (SIGKILL: the test is over). */
export function cleanUp(server: ServerProcess | undefined) {
  if (server && server.proc.exitCode === null && server.proc.signalCode === null) server.proc.kill("SIGKILL");
}
