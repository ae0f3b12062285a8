import { Router } from "express";
import { idParams } from "../../../shared/schemas/common";
import type { Db } from "../../db/client";
import { validate } from "../../middleware/validate";
import { findLookAlikes } from "./look-alikes.service";

export type LookAlikesDeps = {
  /**
   * The inks a signed-in member owns (their stash). When given, a member's answer marks owned
   * look-alikes and names the closest one ("you already own a look-alike"); visitors get none.
   */
  stashOf?: (userId: string) => Promise<ReadonlySet<number>>;
};

/** GET /inks/:id/look-alikes (mounted under /api). */
export function lookAlikesRouter(db: Db, deps: LookAlikesDeps = {}): Router {
  const router = Router();
  router.get("/inks/:id/look-alikes", validate({ params: idParams }), async (req, res) => {
    const user = res.locals.user;
    const ownedInkIds = user && deps.stashOf ? await deps.stashOf(user.id) : undefined;
    if (ownedInkIds) res.set("Cache-Control", "private, no-store");
    res.json(await findLookAlikes(db, Number(req.params.id), { ownedInkIds }));
  });
  return router;
}
