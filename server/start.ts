import { spawnSync } from "node:child_process";
import { existsSync, readdirSync, statSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";

/** `npm start`: build the client when dist/ is missing or older than the sources, then run the server. */
const root = fileURLToPath(new URL("..", import.meta.url));
const builtIndex = path.join(root, "dist", "index.html");

function newestMtime(p: string): number {
  const st = statSync(p);
  if (!st.isDirectory()) return st.mtimeMs;
  return readdirSync(p).reduce((m, name) => Math.max(m, newestMtime(path.join(p, name))), st.mtimeMs);
}

const sources = ["src", "shared", "public", "index.html", "vite.config.ts", "tailwind.config.ts"].map((p) => path.join(root, p)).filter(existsSync);
const stale = !existsSync(builtIndex) || Math.max(...sources.map(newestMtime)) > statSync(builtIndex).mtimeMs;
if (stale) {
  console.log("Building the client (vite build)…");
  const result = spawnSync(path.join(root, "node_modules", ".bin", "vite"), ["build", "--logLevel", "warn"], { cwd: root, stdio: "inherit" });
  if (result.status !== 0) process.exit(result.status ?? 1);
}

const { main } = await import("./index");
await main();
