import { parse } from "csv-parse/sync";
import { stringify } from "csv-stringify/sync";
import { sql } from "kysely";
import type { z } from "zod";
import type { Me } from "../../../shared/schemas/accounts";
import type { Ink } from "../../../shared/schemas/inks";
import { MAX_STASH, stashCsvColumns, type StashImportPreview, type StashImportRow, type StashItem, type stashPut } from "../../../shared/schemas/stash";
import { nowIso, type Db, type DbOrTx } from "../../db/client";
import { AppError } from "../../middleware/errors";
import { toInk } from "../inks/inks.service";

const inkColumns = [
  "inks.id", "inks.name", "inks.type", "inks.hex", "inks.lab_l", "inks.lab_a", "inks.lab_b", "inks.discontinued",
  "inks.created_at", "inks.updated_at", "brands.id as brand_id", "brands.slug as brand_slug", "brands.name as brand_name",
] as const;

const norm = (s: string) => s.normalize("NFKC").trim().toLowerCase().replace(/\s+/g, " ");

async function assertInks(db: DbOrTx, ids: number[]) {
  if (!ids.length) return;
  const found = new Set((await db.selectFrom("inks").select("id").where("id", "in", ids).execute()).map((r) => r.id));
  const missing = ids.filter((id) => !found.has(id));
  if (missing.length) throw new AppError("unknown_inks", "Some inks are not in the catalogue.", 422, { inks: [`unknown ink ids: ${missing.join(", ")}`] });
}

export function stashInkIds(db: DbOrTx, userId: string) {
  return db.selectFrom("stash_items").select("ink_id").where("user_id", "=", userId).execute().then((r) => r.map((x) => x.ink_id));
}

export function createStashService(deps: { db: Db }) {
  const { db } = deps;

  async function list(me: Me): Promise<StashItem[]> {
    const rows = await db
      .selectFrom("stash_items")
      .innerJoin("inks", "inks.id", "stash_items.ink_id")
      .innerJoin("brands", "brands.id", "inks.brand_id")
      .select([...inkColumns, "stash_items.running_low", "stash_items.added_at"])
      .where("stash_items.user_id", "=", me.id)
      .orderBy(sql`brands.name collate nocase`)
      .orderBy(sql`inks.name collate nocase`)
      .execute();
    return rows.map((r) => ({ ink: toInk(r), runningLow: r.running_low === 1, addedAt: r.added_at }));
  }

  return {
    list,

    async replace(me: Me, input: z.output<typeof stashPut>) {
      await db.transaction().execute(async (tx) => {
        await assertInks(tx, input.items.map((i) => i.inkId));
        const before = new Map((await tx.selectFrom("stash_items").selectAll().where("user_id", "=", me.id).execute()).map((r) => [r.ink_id, r.added_at]));
        await tx.deleteFrom("stash_items").where("user_id", "=", me.id).execute();
        if (input.items.length) {
          const now = nowIso();
          await tx
            .insertInto("stash_items")
            .values(input.items.map((i) => ({ user_id: me.id, ink_id: i.inkId, running_low: i.runningLow ? 1 : 0, added_at: before.get(i.inkId) ?? now })) as never)
            .execute();
        }
      });
      return list(me);
    },

    async add(me: Me, inkId: number, runningLow: boolean) {
      await assertInks(db, [inkId]);
      const { n } = await db.selectFrom("stash_items").select((eb) => eb.fn.countAll<number>().as("n")).where("user_id", "=", me.id).executeTakeFirstOrThrow();
      if (Number(n) >= MAX_STASH) throw new AppError("stash_full", `A stash holds at most ${MAX_STASH} inks.`, 422);
      await db
        .insertInto("stash_items")
        .values({ user_id: me.id, ink_id: inkId, running_low: runningLow ? 1 : 0, added_at: nowIso() })
        .onConflict((oc) => oc.columns(["user_id", "ink_id"]).doUpdateSet({ running_low: runningLow ? 1 : 0 }))
        .execute();
      return list(me);
    },

    async setRunningLow(me: Me, inkId: number, runningLow: boolean) {
      const r = await db.updateTable("stash_items").set({ running_low: runningLow ? 1 : 0 }).where("user_id", "=", me.id).where("ink_id", "=", inkId).executeTakeFirst();
      if (!Number(r.numUpdatedRows)) throw new AppError("not_found", "That ink is not in your stash.", 404);
      return list(me);
    },

    async remove(me: Me, inkId: number) {
      await db.deleteFrom("stash_items").where("user_id", "=", me.id).where("ink_id", "=", inkId).execute();
    },

    /** Reads a stash CSV and says what each row matches; nothing is saved. */
    async preview(buf: Buffer): Promise<StashImportPreview> {
      if (!buf.length) throw new AppError("csv_invalid", "The file is empty.", 422, { file: ["is empty"] });
      if (buf.includes(0) || new TextDecoder().decode(buf).includes("\uFFFD")) {
        throw new AppError("csv_invalid", "That file is not a CSV text file.", 422, { file: ["is not a CSV text file"] });
      }
      let records: { record: Record<string, string>; info: { lines: number } }[];
      try {
        records = parse(buf, {
          bom: true,
          info: true,
          skip_empty_lines: true,
          relax_column_count: true,
          columns: (header: string[]) => {
            const cols = header.map((h) => h.trim().toLowerCase().replace(/[\s-]+/g, "_"));
            const missing = ["brand", "name"].filter((c) => !cols.includes(c));
            const unknown = cols.filter((c) => !(stashCsvColumns as readonly string[]).includes(c));
            if (missing.length || unknown.length) {
              throw new AppError("csv_invalid", `The header row must name the columns: ${stashCsvColumns.join(",")}.`, 422, {
                "line 1": [...missing.map((c) => `missing column "${c}"`), ...unknown.map((c) => `unknown column "${c}"`)],
              });
            }
            return cols;
          },
        });
      } catch (err) {
        if (err instanceof AppError) throw err;
        const line = (err as { lines?: number }).lines ?? 0;
        throw new AppError("csv_invalid", "The file could not be read as CSV.", 422, { [`line ${line}`]: [String((err as Error).message)] });
      }
      if (!records.length) throw new AppError("csv_invalid", "The file lists no inks.", 422, { file: ["has a header but no inks"] });
      if (records.length > MAX_STASH) throw new AppError("csv_invalid", "The file is too long.", 422, { file: [`has ${records.length} rows; the limit is ${MAX_STASH}`] });

      const catalogue = (await db.selectFrom("inks").innerJoin("brands", "brands.id", "inks.brand_id").select(inkColumns).execute()).map(toInk);
      const rows: StashImportRow[] = records.map(({ record, info }) => {
        const brand = (record.brand ?? "").trim();
        const name = (record.name ?? "").trim();
        const runningLow = ["yes", "true", "1", "y"].includes((record.running_low ?? "").trim().toLowerCase());
        const byName = catalogue.filter((i) => norm(i.name) === norm(name));
        let candidates: Ink[] = byName;
        if (brand) {
          const b = norm(brand);
          const inBrand = byName.filter((i) => norm(i.brand.name) === b || i.brand.slug === b || norm(i.brand.name).startsWith(b));
          candidates = inBrand;
        }
        const status = candidates.length === 1 ? "matched" : candidates.length > 1 ? "ambiguous" : "unmatched";
        return { line: info.lines, brand, name, runningLow, status, ink: status === "matched" ? candidates[0]! : null, candidates: status === "ambiguous" ? candidates : [] };
      });
      return {
        rows,
        matched: rows.filter((r) => r.status === "matched").length,
        ambiguous: rows.filter((r) => r.status === "ambiguous").length,
        unmatched: rows.filter((r) => r.status === "unmatched").length,
      };
    },

    async exportCsv(me: Me): Promise<string> {
      const items = await list(me);
      return stringify(items.map((i) => [i.ink.brand.name, i.ink.name, i.runningLow ? "yes" : "no"]), { header: true, columns: [...stashCsvColumns] });
    },
  };
}
export type StashService = ReturnType<typeof createStashService>;
