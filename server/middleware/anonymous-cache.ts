import { createHash } from "node:crypto";
import type { RequestHandler } from "express";

const safeMethods = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * A brief in-memory cache for answers every visitor gets alike (the gallery and search), so a
 * busy Saturday does not recompute the same page for each of them. Only for requests without a
 * signed-in member (members' answers carry their stash). An entry is good for `ttlMs` and only
 * while no write has finished since it was computed: any state-changing /api request bumps the
 * generation, so a strip a moderator hides is gone from the next visitor's answer at once.
 * Answers carry an ETag (RFC 9110 §8.8.3) and a short max-age; a matching If-None-Match gets 304.
 */
export function createAnonymousCache(opts: { ttlMs: number; maxEntries: number }) {
  let generation = 0;
  const entries = new Map<string, { body: string; etag: string; generation: number; at: number }>();

  /** Mount before the routers: every finished write makes cached answers stale. */
  const trackWrites: RequestHandler = (req, res, next) => {
    if (!safeMethods.has(req.method)) res.once("finish", () => generation++);
    next();
  };

  function send(res: Parameters<RequestHandler>[1], req: Parameters<RequestHandler>[0], body: string, etag: string) {
    res.set({ ETag: etag, "Cache-Control": `public, max-age=${Math.floor(opts.ttlMs / 1000)}`, Vary: "Cookie" });
    if (req.headers["if-none-match"] === etag) {
      res.status(304).end();
      return;
    }
    res.type("application/json").send(body);
  }

  const fresh = (key: string, now: number) => {
    const hit = entries.get(key);
    return hit && hit.generation === generation && now - hit.at < opts.ttlMs ? hit : undefined;
  };

  /**
   * Before validation: a visitor's hit is answered at once. Only answers to requests that passed
   * validation are ever stored, so skipping it for a hit admits nothing new.
   */
  const lookup: RequestHandler = (req, res, next) => {
    const hit = res.locals.user ? undefined : fresh(req.originalUrl, Date.now());
    if (!hit) return next();
    send(res, req, hit.body, hit.etag);
  };

  /** Wraps one route's JSON answer (after validation): computes, and stores it for visitors. */
  function cached(compute: (req: Parameters<RequestHandler>[0], res: Parameters<RequestHandler>[1]) => Promise<unknown>): RequestHandler {
    return async (req, res) => {
      if (res.locals.user) {
        res.set({ "Cache-Control": "private, no-cache", Vary: "Cookie" }).json(await compute(req, res));
        return;
      }
      const key = req.originalUrl;
      const now = Date.now();
      const hit = fresh(key, now);
      if (hit) {
        send(res, req, hit.body, hit.etag);
        return;
      }
      const startedAt = generation; // a write finishing meanwhile makes this answer stale at once
      const body = JSON.stringify(await compute(req, res));
      const etag = `W/"${createHash("sha1").update(body).digest("base64url").slice(0, 27)}"`;
      if (entries.size >= opts.maxEntries) entries.delete(entries.keys().next().value!); // oldest first
      entries.delete(key);
      entries.set(key, { body, etag, generation: startedAt, at: now });
      send(res, req, body, etag);
    };
  }

  return { trackWrites, lookup, cached, clear: () => entries.clear() };
}
export type AnonymousCache = ReturnType<typeof createAnonymousCache>;
