import { mkdirSync } from "node:fs";
import { readEnv } from "../config";
import { migrateDb, openDb } from "./client";
import { isEmpty, seedDemo } from "./seed/index";

const env = readEnv();
mkdirSync(env.dataDir, { recursive: true });
const db = openDb(env.dbFile);
migrateDb(db);
if (isEmpty(db)) {
  await seedDemo(db, Date.now(), { uploadsDir: env.uploadsDir });
  console.log(`Seeded the demo shop into ${env.dbFile}`);
} else {
  console.log("The database already has users; the demo seed only runs on an empty database.");
}
