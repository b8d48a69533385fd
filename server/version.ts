import { readFileSync } from "node:fs";

/** The app's version, from package.json (what /api/health and every backup's manifest report). */
export const APP_VERSION: string = (JSON.parse(readFileSync(new URL("../package.json", import.meta.url), "utf8")) as { version: string }).version;
