import path from "node:path";
import { backupDataDir } from "../server/db/backup";

// npm run backup [-- <folder>]: a consistent copy of DATA_DIR while the app keeps running.
const dataDir = path.resolve(process.env.DATA_DIR || "./storage");
const stamp = new Date().toISOString().replace(/[-:]/g, "").replace(/\..*/, "").replace("T", "-");
const dest = path.resolve(process.argv[2] ?? path.join("backups", `blendwell-${stamp}`));

const result = await backupDataDir(dataDir, dest).catch((err: Error) => {
  console.error(`Backup failed: ${err.message}`);
  process.exit(1);
});
console.log(`Backed up ${dataDir} into ${result.dir}: database + ${result.files} image files, ${(result.bytes / 1e6).toFixed(1)} MB.`);
const { integrity, foreignKeyProblems, missingFiles } = result.checks;
if (integrity !== "ok" || foreignKeyProblems || missingFiles.length) {
  console.error(`Warning: the copy does not pass its checks: ${JSON.stringify(result.checks)}`);
  process.exit(1);
}
console.log(`Checks: integrity ok, foreign keys ok, every referenced image present. Restore with: npm run restore -- ${path.relative(process.cwd(), dest).startsWith("..") ? dest : path.relative(process.cwd(), dest)}`);
