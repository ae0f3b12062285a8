import type { RequestHandler } from "express";
import type { Db } from "../db/client";
import { latestSuspensionReason } from "../modules/accounts/accounts.repository";
import { isSuspended } from "../modules/strips/strips.service";
import { AppError } from "./errors";

const readMethods = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * Writes a suspended member may still make: they protect the account itself, change nothing
 * anyone else sees, and ending one's own sessions or changing one's password must never be
 * blocked (ASVS 5.0 V7.4.3, V7.5.2). Paths as mounted under /api.
 */
export const WRITES_ALLOWED_WHILE_SUSPENDED = ["POST /me/sign-out-everywhere", "PUT /me/password", "POST /notices/read"] as const;
const allowed = new Set<string>(WRITES_ALLOWED_WHILE_SUSPENDED);

/**
 * Suspension means read-only: the one guard in front of every write under /api (mounted once,
 * before every router, so a new route cannot forget it). The refusal names the end date and
 * the moderator's reason.
 */
export function refuseWritesWhileSuspended(db: Db): RequestHandler {
  return async (req, res, next) => {
    const user = res.locals.user;
    if (!user || readMethods.has(req.method) || !isSuspended(user)) return next();
    if (allowed.has(`${req.method} ${req.path.replace(/\/$/, "")}`)) return next();
    const reason = await latestSuspensionReason(db, user.id);
    const until = user.suspendedUntil!.slice(0, 10);
    throw new AppError(
      "suspended",
      `Your account is suspended until ${until}${reason ? ` (reason: ${reason})` : ""}. Until then you can browse, but not post or change anything.`,
      403,
    );
  };
}
