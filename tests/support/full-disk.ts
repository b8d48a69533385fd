import { execFileSync } from "node:child_process";
import { closeSync, mkdtempSync, openSync, rmSync, writeSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";

/**
 * A real small disk for full-disk tests: a tmpfs of `size` (e.g. "12m"). Root can mount one (CI and this machine
 * run as root); a test that cannot fill a disk must fail rather than pass quietly, so a failed mount throws.
 */
export function mountTmpfs(size: string) {
  const dir = mkdtempSync(path.join(tmpdir(), "cw-tmpfs-"));
  execFileSync("mount", ["-t", "tmpfs", "-o", `size=${size}`, "tmpfs", dir]);
  return {
    dir,
    unmount() {
      execFileSync("umount", [dir]);
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** Writes zeros into `dir/filler` until the disk refuses another byte; delete that file to free the disk. */
export function fillDisk(dir: string) {
  const file = path.join(dir, "filler");
  const fd = openSync(file, "w");
  try {
    for (let size = 64 * 1024; size >= 1; size = Math.floor(size / 2)) {
      try {
        for (;;) writeSync(fd, Buffer.alloc(size));
      } catch (e) {
        if ((e as NodeJS.ErrnoException).code !== "ENOSPC") throw e;
      }
    }
  } finally {
    closeSync(fd);
  }
  return file;
}
