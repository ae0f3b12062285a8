import type { Kysely, Transaction } from "kysely";
import type { Database } from "../../db/schema";

/**
 * The colour index (migration 20261202_0006_search_index): every strip band filed under a cell
 * of (L*, C*ab, h_ab), clustered by cell, kept in step with strip_bands by triggers. Never
 * written by app code. l, a, b are the band's exact L*a*b* (the same values as strip_bands).
 */
export interface StripBandColourTable {
  cell: number;
  /** strip_id * 1024 + position */
  band: number;
  strip_id: number;
  position: number;
  l: number;
  a: number;
  b: number;
  /** C*ab and h_ab (degrees, 0–360), computed by SQLite. */
  c: number;
  h: number;
}

/** Merge into `Database` (server/db/schema.ts). */
export interface SearchTables {
  strip_band_colours: StripBandColourTable;
}

export type SearchDb = Kysely<Database & SearchTables> | Transaction<Database & SearchTables>;

/** Until `Database` includes SearchTables, the search module widens the handle it is given. */
export function searchDb(db: Kysely<Database> | Transaction<Database>): SearchDb {
  return db as unknown as SearchDb;
}
