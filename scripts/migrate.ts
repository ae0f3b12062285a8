import { loadConfig } from "../server/config";
import { openDatabase } from "../server/db/client";
import { migrateDown, migrateToLatest } from "../server/db/migrate";

// npm run migrate            → up to the latest
// npm run migrate -- down    → one step down
const config = loadConfig();
const db = openDatabase(config.dbFile);
const result = process.argv.includes("down") ? await migrateDown(db) : await migrateToLatest(db);
for (const r of result.results ?? []) console.log(`${r.direction} ${r.migrationName}: ${r.status}`);
if (!result.results?.length) console.log("Nothing to migrate.");
await db.destroy();
