import { Router } from "express";
import { readCapturedMail } from "../../mail/local-smtp";

/** Mail caught by the local SMTP server, for developers (only mounted in development and demo). */
export function devMailRouter(dataDir: string): Router {
  const router = Router();
  router.get("/dev/mail", async (_req, res) => {
    res.json({ messages: (await readCapturedMail(dataDir)).slice(0, 100) });
  });
  return router;
}
