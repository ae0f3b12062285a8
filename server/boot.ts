import type { Server } from "node:http";
import type { RequestHandler } from "express";
import pino from "pino";
import { createApp } from "./app";
import { forgetOldSessions } from "./auth/sessions";
import type { AppConfig } from "./config";
import { openDatabase } from "./db/client";
import { migrateToLatest } from "./db/migrate";
import { databaseIsEmpty, demoSignInsText, seedDemo } from "./demo/seed";
import { seedDemoStrips } from "./demo/seed-strips";
import { startLocalSmtp, type LocalSmtp } from "./mail/local-smtp";
import { createMailer } from "./mail/mailer";
import { createOutbox } from "./mail/outbox";
import { createServices } from "./services";

/** Temp files of uploads older than this were cut off (an upload takes seconds, at most minutes). */
export const TEMP_MAX_AGE_MS = 60 * 60 * 1000;

export type Running = { server: Server; url: string; close(): Promise<void> };

/** Migrates, seeds the demo when asked and the database is empty, starts the local fakes, listens. */
export async function boot(
  config: AppConfig,
  opts: { seedIfEmpty?: boolean; clientMiddleware?: RequestHandler } = {},
): Promise<Running> {
  const logger = pino({ level: config.logLevel });
  if (config.demo) logger.warn("demo mode is on: demo accounts can sign in and mail stays on this machine");
  if (config.demoRefused) logger.warn("DEMO_MODE is ignored under NODE_ENV=production: no demo accounts, no mail viewer");
  const db = openDatabase(config.dbFile);
  await migrateToLatest(db);

  const seeding = !!opts.seedIfEmpty && config.demo && (await databaseIsEmpty(db));
  if (seeding) {
    const seeded = await seedDemo(db);
    logger.info(seeded, "demo catalogue and members loaded");
  }

  let smtp: LocalSmtp | null = null;
  if (!config.smtpUrl) {
    smtp = await startLocalSmtp(config.dataDir, Number(process.env.SMTP_PORT ?? 0));
    logger.info({ port: smtp.port }, "local SMTP server listening (mail is kept under DATA_DIR/mail)");
  }
  const mailer = createMailer(config.smtpUrl ? { url: config.smtpUrl } : { host: smtp!.host, port: smtp!.port }, config.mailFrom);

  const services = createServices({ db, config, logger });
  const recovered = await services.uploads.recover();
  if (recovered) logger.info({ recovered }, "unfinished uploads taken up again");
  const cleanup = async () => {
    const removed = await services.uploads.cleanupDrafts();
    if (removed) logger.info({ removed }, "old drafts removed");
    const trash = await services.store.emptyTrash(TEMP_MAX_AGE_MS);
    if (trash) logger.debug({ trash }, "removed files deleted for good");
    const temp = await services.store.removeStaleTemp(TEMP_MAX_AGE_MS);
    if (temp) logger.info({ temp }, "temp upload files left by a crash removed");
    const sessions = await forgetOldSessions(db);
    if (sessions) logger.info({ sessions }, "old session rows removed");
  };
  if (seeding) {
    console.log("Posting the demo strips through the real analysis (first start only, under a minute)…");
    logger.info(await seedDemoStrips({ db, services, logger }), "demo strips posted");
  }
  await cleanup();
  const cleanupTimer = setInterval(() => void cleanup().catch((err) => logger.error({ err }, "draft cleanup failed")), 60 * 60 * 1000);
  cleanupTimer.unref();
  const outbox = createOutbox({ db, mailer, logger });
  outbox.start();
  const app = createApp({ db, config, mailer, logger, services, clientMiddleware: opts.clientMiddleware });
  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(config.port, (err?: Error) => (err ? reject(err) : resolve(s)));
  });
  if (config.demo) console.log("\n" + demoSignInsText(config.appUrl) + "\n");

  return {
    server,
    url: config.appUrl,
    async close() {
      clearInterval(cleanupTimer);
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await outbox.stop();
      await services.close();
      mailer.close();
      await smtp?.close();
      await db.destroy();
    },
  };
}
