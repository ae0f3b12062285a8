import path from "node:path";
import { restoreDataDir } from "../server/db/backup";

// npm run restore -- <backup folder>: into DATA_DIR, which must be empty (stop the app first).
const from = process.argv[2];
if (!from) {
  console.error("Usage: npm run restore -- <backup folder>   (DATA_DIR must be an empty folder)");
  process.exit(2);
}
const dataDir = path.resolve(process.env.DATA_DIR || "./storage");
try {
  await restoreDataDir(path.resolve(from), dataDir);
  console.log(`Restored ${from} into ${dataDir}: integrity ok, foreign keys ok, every referenced image present.`);
  console.log("Start the app as usual. Everyone signs in again: the auth secret is not part of a backup.");
} catch (err) {
  console.error(String((err as Error).message));
  process.exit(1);
}
