import { spawnSync } from "node:child_process";
import { existsSync, readdirSync, statSync } from "node:fs";
import path from "node:path";

// Builds the client when dist/ is missing or older than its sources, then starts the server.
function newestMtime(p: string): number {
  if (!existsSync(p)) return 0;
  const st = statSync(p);
  if (!st.isDirectory()) return st.mtimeMs;
  return Math.max(st.mtimeMs, ...readdirSync(p).map((n) => newestMtime(path.join(p, n))));
}

const built = path.resolve("dist/index.html");
const sources = ["src", "shared", "index.html", "public", "vite.config.ts", "package.json"].map((p) => path.resolve(p));
const stale = !existsSync(built) || Math.max(...sources.map(newestMtime)) > statSync(built).mtimeMs;
if (stale) {
  console.log("Building the client…");
  const result = spawnSync("npx", ["vite", "build", "--logLevel", "warn"], { stdio: "inherit" });
  if (result.status !== 0) process.exit(result.status ?? 1);
}

await import("../server/index");
