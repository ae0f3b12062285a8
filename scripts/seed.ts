import { loadConfig } from "../server/config";
import { openDatabase } from "../server/db/client";
import { migrateToLatest } from "../server/db/migrate";
import { databaseIsEmpty, seedDemo } from "../server/demo/seed";

const config = loadConfig();
const db = openDatabase(config.dbFile);
await migrateToLatest(db);
if (await databaseIsEmpty(db)) {
  console.log("Demo data loaded:", await seedDemo(db));
} else {
  console.log(`The database at ${config.dbFile} already has data; nothing seeded.`);
}
await db.destroy();
