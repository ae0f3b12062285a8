import type { RequestHandler } from "express";
import { AppError } from "./errors";

const safeMethods = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * Our JSON API's guard against cross-site requests (Auth.js guards only its own routes):
 * every state-changing request must come from our own origin, by Origin or else Referer.
 */
export function sameOrigin(appUrl: string): RequestHandler {
  const configured = new URL(appUrl).origin;
  return (req, _res, next) => {
    if (safeMethods.has(req.method)) return next();
    const own = `${req.protocol}://${req.get("host")}`;
    const allowed = (origin: string) => origin === configured || origin === own;
    const origin = req.get("origin");
    if (origin !== undefined) {
      if (allowed(origin)) return next();
      throw new AppError("cross_site", "Requests from other sites are not accepted.", 403);
    }
    const referer = req.get("referer");
    if (referer) {
      let refOrigin = "";
      try {
        refOrigin = new URL(referer).origin;
      } catch {
        /* not a URL: rejected below */
      }
      if (allowed(refOrigin)) return next();
    }
    throw new AppError("cross_site", "Requests from other sites are not accepted.", 403);
  };
}
