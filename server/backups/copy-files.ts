import { copyFileSync, existsSync, linkSync, mkdirSync, readdirSync, statSync, utimesSync, type Stats } from "node:fs";
import path from "node:path";

/** Every file under `dir` as a path relative to it (an absent folder has none). */
export function filesUnder(dir: string, prefix = ""): string[] {
  if (!existsSync(path.join(dir, prefix))) return [];
  const out: string[] = [];
  for (const entry of readdirSync(path.join(dir, prefix), { withFileTypes: true })) {
    const rel = path.join(prefix, entry.name);
    if (entry.isDirectory()) out.push(...filesUnder(dir, rel));
    else if (entry.isFile()) out.push(rel);
  }
  return out;
}

// Times go through utimes as floating-point seconds, so a copy's time can differ from its source's by under a millisecond.
const sameFile = (a: Stats, b: Stats) => a.size === b.size && Math.abs(a.mtimeMs - b.mtimeMs) < 2;

/**
 * Copies the files under `from` into `to` (which must not exist yet), keeping their modification times. A file
 * the previous backup already holds unchanged (same name, size and time; uploads are written once under a random
 * name and never changed) is hard-linked from there instead of copied, so fourteen daily backups of the same
 * photos take the room of one. Files removed while the copy runs are skipped. Returns what was copied.
 */
export function copyFiles(from: string, to: string, previous: string | null): { files: number; bytes: number; linked: number } {
  mkdirSync(to, { recursive: true });
  let files = 0;
  let bytes = 0;
  let linked = 0;
  for (const rel of filesUnder(from)) {
    const src = path.join(from, rel);
    const dest = path.join(to, rel);
    let st: Stats;
    try {
      st = statSync(src);
    } catch {
      continue; // deleted since the listing
    }
    mkdirSync(path.dirname(dest), { recursive: true });
    const old = previous ? path.join(previous, rel) : null;
    let done = false;
    if (old && existsSync(old) && sameFile(statSync(old), st)) {
      try {
        linkSync(old, dest);
        linked++;
        done = true;
      } catch {
        /* another file system or no links there: copy instead */
      }
    }
    if (!done) {
      try {
        copyFileSync(src, dest);
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === "ENOENT" && !existsSync(src)) continue;
        throw err;
      }
      utimesSync(dest, st.atime, st.mtime);
    }
    files++;
    bytes += st.size;
  }
  return { files, bytes, linked };
}

/** Bytes `copyFiles` would write: the files under `from` that `previous` does not already hold unchanged. */
export function bytesToCopy(from: string, previous: string | null): number {
  let bytes = 0;
  for (const rel of filesUnder(from)) {
    try {
      const st = statSync(path.join(from, rel));
      const old = previous ? path.join(previous, rel) : null;
      if (!(old && existsSync(old) && sameFile(statSync(old), st))) bytes += st.size;
    } catch {
      /* deleted since the listing */
    }
  }
  return bytes;
}
