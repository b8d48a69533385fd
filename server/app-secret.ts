import { randomBytes } from "node:crypto";
import { existsSync, readFileSync, writeFileSync } from "node:fs";

/**
 * The server's signing secret: APP_SECRET when set, otherwise one generated on first start and kept in
 * DATA_DIR/secret (mode 600), so signed links stay valid across restarts.
 */
export function loadAppSecret(fromEnv: string | undefined, file: string): string {
  if (fromEnv) return fromEnv;
  if (existsSync(file)) {
    const kept = readFileSync(file, "utf8").trim();
    if (kept.length >= 32) return kept;
  }
  const fresh = randomBytes(32).toString("hex");
  writeFileSync(file, `${fresh}\n`, { mode: 0o600 });
  return fresh;
}
