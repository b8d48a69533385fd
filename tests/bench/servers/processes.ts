import { spawn, type ChildProcess } from "node:child_process";
import { readFileSync } from "node:fs";
import { createServer } from "node:net";
import path from "node:path";

export const ROOT = path.resolve(import.meta.dirname, "../../..");
export type Child = { url: string; proc: ChildProcess; stop: () => Promise<void>; cpuMs: () => number };

/** CPU time (user + system) a process has used so far, from /proc (Linux; clock ticks of 10 ms). */
function cpuMsOf(pid: number) {
  const fields = readFileSync(`/proc/${pid}/stat`, "utf8").split(") ")[1]!.split(" ");
  return (Number(fields[11]) + Number(fields[12])) * 10;
}

/** A free loopback port. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once("error", reject);
    srv.listen(0, "127.0.0.1", () => {
      const { port } = srv.address() as { port: number };
      srv.close(() => resolve(port));
    });
  });
}

/** Starts `script` in node with tsx's loader (plus `nodeArgs`, e.g. --cpu-prof when profiling), in its own process group, and waits until `probe` answers. */
export async function startChild(script: string, env: Record<string, string>, probe = "/api/health", nodeArgs: string[] = []): Promise<Child> {
  const port = await freePort();
  const proc = spawn(process.execPath, ["--import", "tsx", ...nodeArgs, path.join(ROOT, script)], {
    cwd: ROOT,
    env: { ...process.env, ...env, PORT: String(port) },
    stdio: ["ignore", "ignore", "inherit"],
    detached: true,
  });
  const url = `http://127.0.0.1:${port}`;
  const groupAlive = () => {
    try {
      process.kill(-proc.pid!, 0);
      return true;
    } catch {
      return false;
    }
  };
  /** SIGTERM to the whole group, up to 15 s to finish, then SIGKILL. */
  const stop = async () => {
    if (!groupAlive()) return;
    process.kill(-proc.pid!, "SIGTERM");
    for (let i = 0; i < 150 && groupAlive(); i++) await new Promise((r) => setTimeout(r, 100));
    if (groupAlive()) process.kill(-proc.pid!, "SIGKILL");
  };
  for (let i = 0; i < 240; i++) {
    if (proc.exitCode !== null) throw new Error(`${script} exited with ${proc.exitCode}`);
    try {
      const res = await fetch(url + probe);
      if (res.status < 500) return { url, proc, stop, cpuMs: () => cpuMsOf(proc.pid!) };
    } catch {
      /* starting */
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  await stop();
  throw new Error(`${script} did not start`);
}
