import pino from "pino";
import { loadConfig } from "../server/config";
import { openDatabase } from "../server/db/client";
import { migrateToLatest } from "../server/db/migrate";
import { databaseIsEmpty, seedDemo } from "../server/demo/seed";
import { seedDemoStrips } from "../server/demo/seed-strips";
import { createServices } from "../server/services";

const config = loadConfig();
const db = openDatabase(config.dbFile);
await migrateToLatest(db);
if (await databaseIsEmpty(db)) {
  const logger = pino({ level: "warn" });
  console.log("Demo catalogue and members:", await seedDemo(db));
  const services = createServices({ db, config, logger });
  console.log("Demo strips:", await seedDemoStrips({ db, services, logger }));
  await services.close();
} else {
  console.log(`The database at ${config.dbFile} already has data; nothing seeded.`);
}
await db.destroy();
