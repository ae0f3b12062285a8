import { Router } from "express";
import { requireRole } from "../../auth/current-user";
import { readCapturedMail } from "../../mail/local-smtp";

/**
 * Mail caught by the local SMTP server, for trying the demo. Mounted only in demo mode (never
 * in production) and only for signed-in admins: the mail holds sign-in links, so anyone who can
 * read it can sign in as anyone (issue 12).
 */
export function devMailRouter(dataDir: string): Router {
  const router = Router();
  router.get("/dev/mail", requireRole("admin"), async (_req, res) => {
    res.set("Cache-Control", "no-store").json({ messages: (await readCapturedMail(dataDir)).slice(0, 100) });
  });
  return router;
}
