import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";

export type RateLimitConfig = {
  /** Password sign-in tries per IP per window. */
  signInPerIp: number;
  /** Sign-in e-mails per address per window. */
  mailPerAddress: number;
  /** Sign-in e-mails per IP per window. */
  mailPerIp: number;
  windowMs: number;
  /** Multiplies the per-member limits on uploads, posts and reports. */
  memberScale: number;
};

export type AppConfig = {
  port: number;
  dataDir: string;
  dbFile: string;
  /** Vite middleware and reload instead of the built client. */
  dev: boolean;
  production: boolean;
  /** Demo accounts may sign in and the local SMTP server + mail viewer (admins only) are on. Never in production. */
  demo: boolean;
  /** DEMO_MODE was asked for under NODE_ENV=production and refused (start-up says so). */
  demoRefused: boolean;
  /** Public origin, e.g. http://localhost:3000; used in mail links and the Origin check. */
  appUrl: string;
  authSecret: string;
  mailFrom: string;
  /** SMTP URL of a real mail host; when unset the app starts its own local SMTP server. */
  smtpUrl: string | null;
  /** Number of proxy hops to trust for the client address (0: none). */
  trustProxy: number;
  logLevel: string;
  rateLimits: RateLimitConfig;
};

function flag(value: string | undefined): boolean | undefined {
  if (value === undefined || value === "") return undefined;
  return ["1", "true", "yes", "on"].includes(value.toLowerCase());
}

function intFrom(value: string | undefined, fallback: number, name: string): number {
  if (value === undefined || value === "") return fallback;
  const n = Number(value);
  if (!Number.isInteger(n) || n < 0) throw new Error(`${name} must be a whole number, got "${value}"`);
  return n;
}

/** An AUTH_SECRET kept in the data folder, made on first start when none is given. */
function authSecretFor(dataDir: string, given: string | undefined): string {
  if (given) return given;
  const file = path.join(dataDir, "auth-secret");
  if (existsSync(file)) return readFileSync(file, "utf8").trim();
  const secret = randomBytes(32).toString("base64url");
  writeFileSync(file, secret + "\n", { mode: 0o600 });
  return secret;
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env, opts: { dev?: boolean } = {}): AppConfig {
  const production = env.NODE_ENV === "production";
  const dataDir = path.resolve(env.DATA_DIR || "./storage");
  mkdirSync(dataDir, { recursive: true });
  const port = intFrom(env.PORT, 3000, "PORT");
  const scale = intFrom(env.RATE_LIMIT_MULTIPLIER, 1, "RATE_LIMIT_MULTIPLIER") || 1;
  return {
    port,
    dataDir,
    dbFile: path.join(dataDir, "blendwell.sqlite"),
    dev: opts.dev ?? false,
    production,
    // Production never serves demo accounts or the mail viewer, whatever DEMO_MODE says.
    demo: !production && (flag(env.DEMO_MODE) ?? true),
    demoRefused: production && flag(env.DEMO_MODE) === true,
    appUrl: (env.APP_URL || `http://localhost:${port}`).replace(/\/$/, ""),
    authSecret: authSecretFor(dataDir, env.AUTH_SECRET),
    mailFrom: env.MAIL_FROM || "Blendwell <hello@blendwell.test>",
    smtpUrl: env.SMTP_URL || null,
    trustProxy: intFrom(env.TRUST_PROXY, 0, "TRUST_PROXY"),
    logLevel: env.LOG_LEVEL || (production ? "info" : "info"),
    rateLimits: {
      signInPerIp: 30 * scale,
      mailPerAddress: 5 * scale,
      mailPerIp: 20 * scale,
      windowMs: 10 * 60 * 1000,
      memberScale: scale,
    },
  };
}
