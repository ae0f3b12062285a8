import { fileURLToPath } from "node:url";
import type { Logger } from "pino";
import type { AppConfig } from "./config";
import type { Db } from "./db/client";
import { createWorkerPool } from "./jobs/worker-pool";
import type { UploadJob, UploadJobResult } from "./modules/uploads/upload-job";
import { createBindersService } from "./modules/binders/binders.service";
import { createModerationService } from "./modules/moderation/moderation.service";
import { createPlanService } from "./modules/plan/plan.service";
import { createStashService } from "./modules/stash/stash.service";
import { createStripsService } from "./modules/strips/strips.service";
import { createUploadsService } from "./modules/uploads/uploads.service";
import { createLocalFileStore } from "./storage/file-store";

const uploadWorker = fileURLToPath(new URL("./modules/uploads/upload-worker.ts", import.meta.url));

/** The long-lived parts the app needs besides the database: file store, worker pool, services. */
export function createServices(deps: { db: Db; config: AppConfig; logger: Logger; maxQueue?: number; maxThreads?: number }) {
  const store = createLocalFileStore(deps.config.dataDir);
  const pool = createWorkerPool<UploadJob, UploadJobResult>({
    filename: uploadWorker,
    maxQueue: deps.maxQueue,
    maxThreads: deps.maxThreads,
  });
  const uploads = createUploadsService({ db: deps.db, store, pool, logger: deps.logger });
  const strips = createStripsService({ db: deps.db, store });
  const moderation = createModerationService({ db: deps.db, appUrl: deps.config.appUrl });
  return {
    store,
    uploads,
    strips,
    moderation,
    binders: createBindersService({ db: deps.db }),
    stash: createStashService({ db: deps.db }),
    plan: createPlanService({ db: deps.db }),
    async close() {
      await uploads.idle();
      await pool.close();
    },
  };
}
export type Services = ReturnType<typeof createServices>;
