import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { existsSync, mkdtempSync, mkdirSync } from "node:fs";
import { createServer } from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";
import type { TestProject } from "vitest/node";

/**
 * Starts the real product (built SPA + API + SMTP stand-in, demo data) on a free port with a throwaway
 * DATA_DIR, the way `npm start` does, and hands its URL to the specs.
 */
const root = path.resolve(import.meta.dirname, "../..");
let server: ChildProcess | undefined;

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    dataDir: string;
  }
}

async function waitFor(url: string, ms: number) {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    try {
      const res = await fetch(url);
      if (res.ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`Server did not answer at ${url} within ${ms} ms`);
}

/** A port nobody is listening on now (several test runs may share this machine). */
function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer().once("error", reject);
    probe.listen(0, "127.0.0.1", () => {
      const { port } = probe.address() as { port: number };
      probe.close(() => resolve(port));
    });
  });
}

export default async function setup(project: TestProject) {
  if (!existsSync(path.join(root, "dist", "index.html"))) {
    const build = spawnSync(path.join(root, "node_modules/.bin/vite"), ["build", "--logLevel", "warn"], { cwd: root, stdio: "inherit" });
    if (build.status !== 0) throw new Error("vite build failed");
  }
  mkdirSync(path.join(root, "test-results"), { recursive: true });
  const dataDir = mkdtempSync(path.join(tmpdir(), "cw-e2e-"));
  const port = await freePort();
  server = spawn(path.join(root, "node_modules/.bin/tsx"), ["server/index.ts"], {
    cwd: root,
    // Every spec signs in from 127.0.0.1, so the per-address sign-in limit is raised for the run. Request lines are
    // left out of the test output (warnings and errors still show) unless LOG_LEVEL asks for them.
    env: { LOG_LEVEL: "warn", ...process.env, PORT: String(port), DATA_DIR: dataDir, DEMO_MODE: "1", SIGNIN_LIMIT_PER_ADDRESS: "10000" },
    stdio: ["ignore", "inherit", "inherit"],
    detached: true,
  });
  const baseUrl = `http://localhost:${port}`;
  await waitFor(`${baseUrl}/api/health`, 60_000);
  project.provide("baseUrl", baseUrl);
  project.provide("dataDir", dataDir);
  return () => {
    if (server?.pid) process.kill(-server.pid, "SIGTERM");
  };
}
