import { getSession, type ExpressAuthConfig } from "@auth/express";
import type { Request, RequestHandler } from "express";
import type { Me, Role } from "../../shared/schemas/accounts";
import type { Db } from "../db/client";
import { AppError } from "../middleware/errors";
import { loadMe } from "../modules/accounts/accounts.service";
import { checkSession } from "./sessions";

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Locals {
      user: Me | null;
      /** The member_sessions id of the signed-in request (see ./sessions.ts). */
      sessionId: string | null;
    }
  }
}

/**
 * Loads the signed-in member (fresh from the database, so role changes apply at once), but only
 * while the server-side session the cookie names is still open.
 */
export function loadCurrentUser(db: Db, authConfig: ExpressAuthConfig, opts: { demoAllowed: boolean }): RequestHandler {
  return async (req, res, next) => {
    res.locals.user = null;
    res.locals.sessionId = null;
    if (!hasSessionCookie(req)) return next();
    const session = (await getSession(req, authConfig)) as { user?: { id?: string }; sid?: string } | null;
    const id = session?.user?.id;
    const sid = session?.sid;
    // A cookie without a session id predates server-side sessions: it counts as signed out.
    if (!id || !sid) return next();
    const check = await checkSession(db, sid, id, { demoAllowed: opts.demoAllowed });
    if (!check.ok) return next();
    res.locals.user = await loadMe(db, id);
    res.locals.sessionId = res.locals.user ? sid : null;
    next();
  };
}

function hasSessionCookie(req: Request) {
  return /(^|;\s*)(__Secure-)?authjs\.session-token(\.\d+)?=/.test(req.headers.cookie ?? "");
}

export const requireUser: RequestHandler = (_req, res, next) => {
  if (!res.locals.user) throw new AppError("unauthenticated", "Please sign in first.", 401);
  next();
};

const rank: Record<Role, number> = { member: 0, moderator: 1, admin: 2 };

/** Allows the given roles; an admin can do everything a moderator can. */
export function requireRole(...roles: Role[]): RequestHandler {
  const lowest = Math.min(...roles.map((r) => rank[r]));
  return (_req, res, next) => {
    const user = res.locals.user;
    if (!user) throw new AppError("unauthenticated", "Please sign in first.", 401);
    if (rank[user.role] < lowest) throw new AppError("forbidden", "Your role does not allow this.", 403);
    next();
  };
}
