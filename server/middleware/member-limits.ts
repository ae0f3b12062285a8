import { rateLimit } from "express-rate-limit";

/**
 * A per-member limit (by account, not address) that is tighter for new members than for
 * trusted ones; used on posting, uploads and reports. Runs after the current user is loaded.
 */
export function memberLimit(opts: { windowMs: number; newMember: number; trusted: number; message: string; scale?: number }) {
  const scale = opts.scale ?? 1;
  return rateLimit({
    windowMs: opts.windowMs,
    limit: (_req, res) =>
      scale * (res.locals.user?.standing === "trusted" || res.locals.user?.role !== "member" ? opts.trusted : opts.newMember),
    keyGenerator: (_req, res) => `member:${res.locals.user?.id ?? "anonymous"}`,
    standardHeaders: "draft-8",
    legacyHeaders: false,
    handler: (_req, res, _next, options) => {
      res.status(options.statusCode).json({ error: { code: "rate_limited", message: opts.message } });
    },
  });
}
