import { loadConfig } from "./config";
import { boot } from "./boot";

const dev = process.argv.includes("--dev");
const config = loadConfig(process.env, { dev });

let clientMiddleware;
if (dev) {
  const { createServer } = await import("vite");
  const vite = await createServer({ server: { middlewareMode: true }, appType: "spa" });
  clientMiddleware = vite.middlewares;
}

const running = await boot(config, { seedIfEmpty: true, clientMiddleware });

for (const signal of ["SIGINT", "SIGTERM"] as const) {
  process.once(signal, () => {
    running.close().finally(() => process.exit(0));
  });
}
