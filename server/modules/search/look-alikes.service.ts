import { deltaE2000, describeDeltaE } from "../../../shared/colour";
import { LOOK_ALIKE_DELTA_E, type LookAlike, type LookAlikeList } from "../../../shared/schemas/search";
import type { DbOrTx } from "../../db/client";
import { notFound } from "../../middleware/errors";
import { toInk } from "../inks/inks.service";
import { searchDb } from "./search-tables";

/** Shown beside the words, wherever they appear. */
export const DELTA_E_SCALE =
  "ΔE2000 up to 1: indistinguishable, up to 2: barely different, up to 5: similar. These bands are common practice among colour practitioners, not a published standard.";

const round2 = (n: number) => Math.round(n * 100) / 100;

export type LookAlikeOptions = {
  /**
   * The viewer's stash (inks they own), when known. Then each look-alike says whether it is
   * owned and `ownedLookAlike` names the closest owned one ("you already own a look-alike").
   */
  ownedInkIds?: ReadonlySet<number>;
};

/**
 * Catalogue inks within ΔE2000 5 of an ink's reference colour, closest first (then by id). The
 * catalogue is small (hundreds to a few thousand inks), so this compares against every ink.
 * ΔE is rounded to two decimals before the cut and the words, so the number shown and the words
 * beside it always agree.
 */
export async function findLookAlikes(db: DbOrTx, inkId: number, opts: LookAlikeOptions = {}): Promise<LookAlikeList> {
  const rows = await searchDb(db)
    .selectFrom("inks")
    .innerJoin("brands", "brands.id", "inks.brand_id")
    .select([
      "inks.id",
      "inks.name",
      "inks.type",
      "inks.hex",
      "inks.lab_l",
      "inks.lab_a",
      "inks.lab_b",
      "inks.discontinued",
      "inks.created_at",
      "inks.updated_at",
      "brands.id as brand_id",
      "brands.slug as brand_slug",
      "brands.name as brand_name",
    ])
    .execute();
  const ink = rows.find((r) => r.id === inkId);
  if (!ink) throw notFound("That ink");
  const from = { l: ink.lab_l, a: ink.lab_a, b: ink.lab_b };
  const items: LookAlike[] = [];
  for (const other of rows) {
    if (other.id === inkId) continue;
    const deltaE = round2(deltaE2000(from, { l: other.lab_l, a: other.lab_a, b: other.lab_b }));
    if (deltaE > LOOK_ALIKE_DELTA_E) continue;
    items.push({
      ink: toInk(other),
      deltaE,
      words: describeDeltaE(deltaE),
      ...(opts.ownedInkIds && { owned: opts.ownedInkIds.has(other.id) }),
    });
  }
  items.sort((a, b) => a.deltaE - b.deltaE || a.ink.id - b.ink.id);
  return {
    ink: toInk(ink),
    items,
    maxDeltaE: LOOK_ALIKE_DELTA_E,
    scale: DELTA_E_SCALE,
    ...(opts.ownedInkIds && { ownedLookAlike: items.find((i) => i.owned) ?? null }),
  };
}
