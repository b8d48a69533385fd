import { mkdirSync } from "node:fs";
import { readEnv } from "../config";
import { migrateDb, openDb } from "./client";

const env = readEnv();
mkdirSync(env.dataDir, { recursive: true });
const db = openDb(env.dbFile);
migrateDb(db);
console.log(`Migrated ${env.dbFile}`);
