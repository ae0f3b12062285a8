import type { ExpressAuthConfig } from "@auth/express";
import Credentials from "@auth/express/providers/credentials";
import Nodemailer from "@auth/express/providers/nodemailer";
import { KyselyAdapter } from "@auth/kysely-adapter";
import { z } from "zod";
import { emailSchema } from "../../shared/schemas/accounts";
import type { AppConfig } from "../config";
import type { Db } from "../db/client";
import type { Mailer } from "../mail/mailer";
import { ensureProfile } from "../modules/accounts/accounts.service";
import { findAccountRow, findProfile, findUserByEmail } from "../modules/accounts/accounts.repository";
import { DUMMY_HASH, verifyPassword } from "./passwords";
import { endSession, SESSION_MAX_AGE_S, startSession } from "./sessions";
import { signInMail } from "./sign-in-mail";

const credentialsSchema = z.object({ email: emailSchema, password: z.string().min(1).max(200) });

/** Strict: one address, lower case, no display names or comments. */
export function normalizeEmail(identifier: string): string {
  const parsed = emailSchema.safeParse(identifier);
  if (!parsed.success || /[\s,;<>()"]/.test(parsed.data)) throw new Error("Not a single e-mail address");
  return parsed.data;
}

export function createAuthConfig(deps: { db: Db; config: AppConfig; mailer: Mailer }): ExpressAuthConfig {
  const { db, config, mailer } = deps;
  return {
    secret: config.authSecret,
    trustHost: true,
    basePath: "/auth",
    // Magic links and passwords together need JWT sessions; the adapter still keeps users and tokens.
    // The JWT names a row in member_sessions, checked on every request (docs/decisions/006).
    session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_S },
    // The adapter types its own table set; ours is a superset of it.
    adapter: KyselyAdapter(db as unknown as Parameters<typeof KyselyAdapter>[0]),
    pages: {
      signIn: "/sign-in",
      verifyRequest: "/sign-in/check-email",
      error: "/sign-in/error",
    },
    providers: [
      Nodemailer({
        server: { host: "127.0.0.1", port: 25 },
        from: config.mailFrom,
        maxAge: 10 * 60,
        normalizeIdentifier: normalizeEmail,
        async sendVerificationRequest({ identifier, url }) {
          await mailer.send(signInMail(identifier, url, config.appUrl));
        },
      }),
      Credentials({
        credentials: { email: { label: "E-mail" }, password: { label: "Password", type: "password" } },
        async authorize(raw) {
          const parsed = credentialsSchema.safeParse(raw);
          if (!parsed.success) return null;
          const { email, password } = parsed.data;
          const user = await findUserByEmail(db, email);
          const account = user ? await findAccountRow(db, user.id) : undefined;
          const ok = await verifyPassword(password, account?.password_hash ?? DUMMY_HASH);
          if (!ok || !account) return null;
          if (account.is_demo && !config.demo) return null;
          return { id: account.id, email: account.email, name: account.name };
        },
      }),
    ],
    callbacks: {
      async signIn({ user }) {
        // Production never serves demo accounts, by password or by e-mailed link.
        if (config.demo || !user.id) return true;
        const profile = await findProfile(db, user.id);
        return profile?.is_demo !== 1;
      },
      async jwt({ token, user }) {
        // `user` is given only at sign-in: that is when a server-side session begins.
        if (user?.id) {
          token.sub = user.id;
          token.sid = await startSession(db, user.id);
        }
        return token;
      },
      session({ session, token }) {
        return { expires: session.expires, user: { id: token.sub ?? "" }, sid: typeof token.sid === "string" ? token.sid : "" } as unknown as typeof session;
      },
    },
    events: {
      async signOut(message) {
        const sid = "token" in message ? message.token?.sid : undefined;
        if (typeof sid === "string") await endSession(db, sid, "signed out");
      },
      async createUser({ user }) {
        if (user.id && user.email) await ensureProfile(db, { id: user.id, email: user.email, name: user.name });
      },
    },
    logger: {
      error(error) {
        // Auth.js logs expected sign-in failures as errors; keep them quiet but visible in debug.
        if (!config.production && process.env.LOG_LEVEL === "debug") console.error(error);
      },
      warn() {},
      debug() {},
    },
  };
}
