import { once } from "node:events";
import { mkdtempSync, rmSync } from "node:fs";
import type { Server } from "node:http";
import os from "node:os";
import path from "node:path";
import pino from "pino";
import request from "supertest";
import type TestAgent from "supertest/lib/agent";
import { createApp } from "../../server/app";
import { loadConfig, type AppConfig } from "../../server/config";
import { openDatabase, type Db } from "../../server/db/client";
import { migrateToLatest } from "../../server/db/migrate";
import { seedDemo } from "../../server/demo/seed";
import { readCapturedMail, startLocalSmtp, type LocalSmtp } from "../../server/mail/local-smtp";
import { createMailer } from "../../server/mail/mailer";
import { createOutbox, type Outbox } from "../../server/mail/outbox";
import { createServices, type Services } from "../../server/services";

export const ORIGIN = "http://localhost:3000";

export type TestApp = {
  /** The app, listening on a port of its own for the whole test file (links keep one origin). */
  app: Server;
  db: Db;
  config: AppConfig;
  smtp: LocalSmtp;
  services: Services;
  /** Sends queued notice mail now (the app runs this on a timer). */
  outbox: Outbox;
  /** A fresh cookie-keeping client that sends our Origin on every request. */
  client(): TestAgent;
  mail(): ReturnType<typeof readCapturedMail>;
  close(): Promise<void>;
};

/** A real app on a temporary data folder: migrated SQLite file, local SMTP server, demo data. */
export async function createTestApp(
  opts: {
    seed?: boolean;
    env?: Record<string, string>;
    limits?: Partial<AppConfig["rateLimits"]>;
    services?: { maxQueue?: number; maxThreads?: number };
  } = {},
): Promise<TestApp> {
  const dataDir = mkdtempSync(path.join(os.tmpdir(), "blendwell-test-"));
  const base = loadConfig({ DATA_DIR: dataDir, NODE_ENV: "test", APP_URL: ORIGIN, ...opts.env });
  const config: AppConfig = { ...base, rateLimits: { ...base.rateLimits, signInPerIp: 1000, mailPerIp: 1000, mailPerAddress: 1000, memberScale: 100, ...opts.limits } };
  const db = openDatabase(config.dbFile);
  await migrateToLatest(db);
  if (opts.seed !== false) await seedDemo(db);
  const smtp = await startLocalSmtp(dataDir);
  const mailer = createMailer({ host: smtp.host, port: smtp.port }, config.mailFrom);
  const logger = pino({ level: "silent" });
  const services = createServices({ db, config, logger, maxThreads: 1, ...opts.services });
  const outbox = createOutbox({ db, mailer, logger });
  const app = createApp({ db, config, mailer, logger, services }).listen(0, "127.0.0.1");
  await once(app, "listening");
  return {
    app,
    db,
    config,
    smtp,
    services,
    outbox,
    client: () => request.agent(app).set("Origin", ORIGIN),
    mail: () => readCapturedMail(dataDir),
    async close() {
      await new Promise((resolve) => app.close(resolve));
      await services.close();
      mailer.close();
      await smtp.close();
      await db.destroy();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

export const DEMO = {
  member: "mara@blendwell.test",
  newMember: "noor@blendwell.test",
  moderator: "ivo@blendwell.test",
  admin: "admin@blendwell.test",
  password: "blendwell-demo",
} as const;

/** Signs in through Auth.js's credentials route, as the sign-in page does. */
export async function signIn(agent: TestAgent, email: string, password: string = DEMO.password) {
  const csrf = await agent.get("/auth/csrf").expect(200);
  const res = await agent
    .post("/auth/callback/credentials")
    .set("X-Auth-Return-Redirect", "1")
    .type("form")
    .send({ csrfToken: csrf.body.csrfToken, email, password, callbackUrl: "/account" });
  return res;
}

export async function signedIn(t: TestApp, email: string) {
  const agent = t.client();
  const res = await signIn(agent, email);
  if (res.status !== 200 || String(res.body.url).includes("error=")) {
    throw new Error(`could not sign in as ${email}: ${res.status} ${JSON.stringify(res.body)}`);
  }
  return agent;
}

function cookiePairs(setCookie: string[] | string | undefined): string[] {
  return [setCookie ?? []].flat().map((c) => c.split(";")[0]!);
}

/** The session cookie ("name=value") of a fresh password sign-in, for bare requests. */
export async function sessionCookieFor(t: TestApp, email: string): Promise<string> {
  const csrf = await request(t.app).get("/auth/csrf").expect(200);
  const res = await request(t.app)
    .post("/auth/callback/credentials")
    .set("Cookie", cookiePairs(csrf.headers["set-cookie"]).join("; "))
    .set("X-Auth-Return-Redirect", "1")
    .type("form")
    .send({ csrfToken: csrf.body.csrfToken, email, password: DEMO.password, callbackUrl: "/" });
  const session = cookiePairs(res.headers["set-cookie"]).find((c) => c.startsWith("authjs.session-token="));
  if (!session) throw new Error(`no session cookie for ${email}: ${JSON.stringify(res.body)}`);
  return session;
}
