import express, { type RequestHandler } from "express";
import { ipKeyGenerator, rateLimit, type Options } from "express-rate-limit";
import type { RateLimitConfig } from "../config";

const tooMany = (message: string): Partial<Options> => ({
  standardHeaders: "draft-8",
  legacyHeaders: false,
  handler: (_req, res, _next, options) => {
    res.status(options.statusCode).json({ error: { code: "rate_limited", message } });
  },
});

const ipKey = (req: express.Request) => ipKeyGenerator(req.ip ?? "unknown");

function emailOf(req: express.Request): string {
  const email = typeof req.body?.email === "string" ? req.body.email.trim().toLowerCase() : "";
  return email.slice(0, 254);
}

/** Limits for sign-in by password and for sending sign-in mail (Auth.js routes). */
export function signInLimits(limits: RateLimitConfig): { passwords: RequestHandler[]; mail: RequestHandler[] } {
  const parseForm = express.urlencoded({ extended: false, limit: "16kb" });
  const passwords = rateLimit({
    windowMs: limits.windowMs,
    limit: limits.signInPerIp,
    keyGenerator: ipKey,
    ...tooMany("Too many sign-in attempts. Please wait a few minutes and try again."),
  });
  const mailPerIp = rateLimit({
    windowMs: limits.windowMs,
    limit: limits.mailPerIp,
    keyGenerator: ipKey,
    ...tooMany("Too many sign-in links were asked for. Please wait a few minutes."),
  });
  const mailPerAddress = rateLimit({
    windowMs: limits.windowMs,
    limit: limits.mailPerAddress,
    keyGenerator: (req) => `mail:${emailOf(req)}`,
    ...tooMany("We already sent several links to that address. Check your inbox, or wait a few minutes."),
  });
  return { passwords: [parseForm, passwords], mail: [parseForm, mailPerIp, mailPerAddress] };
}
