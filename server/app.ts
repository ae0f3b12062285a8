import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { ExpressAuth } from "@auth/express";
import express, { type RequestHandler } from "express";
import helmet from "helmet";
import { pinoHttp } from "pino-http";
import type { Logger } from "pino";
import { createAuthConfig } from "./auth/auth-config";
import { loadCurrentUser } from "./auth/current-user";
import type { AppConfig } from "./config";
import type { Db } from "./db/client";
import type { Mailer } from "./mail/mailer";
import { createAnonymousCache } from "./middleware/anonymous-cache";
import { apiNotFound, AppError, errorHandler, refuseInvalidUtf8 } from "./middleware/errors";
import { signInLimits } from "./middleware/rate-limits";
import { sameOrigin } from "./middleware/same-origin";
import { refuseWritesWhileSuspended } from "./middleware/suspension";
import { accountsRouter } from "./modules/accounts/accounts.router";
import { devMailRouter } from "./modules/dev/dev-mail.router";
import { inksRouter } from "./modules/inks/inks.router";
import { bindersRouter } from "./modules/binders/binders.router";
import { moderationRouter } from "./modules/moderation/moderation.router";
import { planRouter } from "./modules/plan/plan.router";
import { lookAlikesRouter } from "./modules/search/look-alikes.router";
import { stashInkIds } from "./modules/stash/stash.service";
import { stashRouter } from "./modules/stash/stash.router";
import { stripsRouter } from "./modules/strips/strips.router";
import { uploadsRouter } from "./modules/uploads/uploads.router";
import type { Services } from "./services";

export type AppDeps = {
  db: Db;
  config: AppConfig;
  mailer: Mailer;
  logger: Logger;
  services: Pick<Services, "store" | "uploads" | "strips" | "moderation" | "binders" | "stash" | "plan">;
  /** In development: Vite's middleware instead of the built client. */
  clientMiddleware?: RequestHandler;
  /** Folder of the built client (default ./dist). */
  clientDir?: string;
};

export function createApp(deps: AppDeps) {
  const { db, config, mailer, logger } = deps;
  const app = express();
  app.set("trust proxy", config.trustProxy);
  app.disable("x-powered-by");

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          "script-src": config.dev ? ["'self'", "'unsafe-inline'"] : ["'self'"],
          "style-src": ["'self'", "'unsafe-inline'"],
          "img-src": ["'self'", "data:", "blob:"],
          "font-src": ["'self'"],
          "connect-src": config.dev ? ["'self'", "ws:"] : ["'self'"],
          "upgrade-insecure-requests": config.production ? [] : null,
        },
      },
      hsts: config.production,
    }),
  );
  app.use(
    pinoHttp({
      logger,
      autoLogging: { ignore: (req) => !/^\/(api|auth)\//.test(req.url ?? "") },
      // Paths only: query strings can carry one-time sign-in tokens.
      serializers: {
        req: (req: { method: string; url: string }) => ({ method: req.method, path: req.url.split("?")[0] }),
        res: (res: { statusCode: number }) => ({ status: res.statusCode }),
      },
    }),
  );

  const authConfig = createAuthConfig({ db, config, mailer });
  const limits = signInLimits(config.rateLimits);
  app.post("/auth/callback/credentials", ...limits.passwords);
  app.post("/auth/signin/nodemailer", ...limits.mail);
  // Auth.js's own body parsing takes JSON too, and some shapes of it crash inside Auth.js (a 500);
  // every form we post to it is URL-encoded, so nothing else gets there.
  app.post("/auth/{*action}", (req, _res, next) => {
    if (!req.is("application/x-www-form-urlencoded")) {
      throw new AppError("unsupported_media_type", "Send sign-in forms as application/x-www-form-urlencoded.", 415);
    }
    next();
  });
  app.use("/auth", ExpressAuth(authConfig));

  const api = express.Router();
  api.use(express.json({ limit: "100kb", strict: true, verify: refuseInvalidUtf8 }));
  api.use(sameOrigin(config.appUrl));
  api.use(loadCurrentUser(db, authConfig, { demoAllowed: config.demo }));
  api.use(refuseWritesWhileSuspended(db));
  // Visitors' gallery and search answers, a few seconds at most and never past a write.
  const visitorCache = createAnonymousCache({ ttlMs: 5000, maxEntries: 500 });
  api.use(visitorCache.trackWrites);
  api.get("/health", (_req, res) => {
    res.json({ ok: true });
  });
  api.use(accountsRouter(db));
  api.use(inksRouter(db));
  const scale = config.rateLimits.memberScale;
  api.use(uploadsRouter({ ...deps.services, limitScale: scale }));
  api.use(stripsRouter(deps.services.strips, scale, visitorCache));
  api.use(moderationRouter(deps.services.moderation, scale));
  api.use(bindersRouter(deps.services.binders));
  api.use(stashRouter(deps.services.stash));
  api.use(planRouter(deps.services.plan));
  api.use(lookAlikesRouter(db, { stashOf: async (userId) => new Set(await stashInkIds(db, userId)) }));
  if (config.demo) api.use(devMailRouter(config.dataDir));
  api.use(apiNotFound);
  app.use("/api", api);

  if (deps.clientMiddleware) {
    app.use(deps.clientMiddleware);
  } else {
    const clientDir = deps.clientDir ?? path.resolve("dist");
    const index = path.join(clientDir, "index.html");
    // The page every client route gets, read once: it changes only with a new build, which
    // means a restart (`npm start` builds first). Saves the file calls on every page view.
    let indexHtml: string | null = null;
    const serveIndex: RequestHandler = (req, res, next) => {
      if (req.path.startsWith("/auth/")) return next();
      if (indexHtml === null) {
        if (!existsSync(index)) {
          res.status(503).type("text").send("The client is not built yet: run `npm run build`.");
          return;
        }
        indexHtml = readFileSync(index, "utf8");
      }
      res.set("Cache-Control", "public, max-age=0").type("html").send(indexHtml);
    };
    app.get("/", serveIndex); // before the static files: "/" is never a file there
    app.use(express.static(clientDir, { index: false, maxAge: "1h" }));
    app.get("/{*path}", serveIndex);
  }

  app.use(errorHandler);
  return app;
}
