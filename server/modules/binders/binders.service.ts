import { sql } from "kysely";
import type { z } from "zod";
import type { Me } from "../../../shared/schemas/accounts";
import {
  MAX_BINDER_ITEMS,
  type Binder,
  type BinderItem,
  type BinderSummary,
  type binderInput,
  type binderItemInput,
  type binderOrderInput,
  type binderPatch,
} from "../../../shared/schemas/binders";
import { nowIso, type Db, type DbOrTx } from "../../db/client";
import type { BinderTable } from "../../db/schema";
import type { Selectable } from "kysely";
import { AppError, notFound } from "../../middleware/errors";
import { hydrate, isSuspended } from "../strips/strips.service";

type BinderRow = Selectable<BinderTable>;

/** Saves = members who keep the strip in a binder (one member's several binders count once). */
async function recountSaves(db: DbOrTx, stripId: number) {
  await db
    .updateTable("strips")
    .set({
      saves: sql<number>`(select count(distinct binders.owner_id) from binder_items join binders on binders.id = binder_items.binder_id where binder_items.strip_id = ${stripId})`,
    })
    .where("id", "=", stripId)
    .execute();
}

export function createBindersService(deps: { db: Db }) {
  const { db } = deps;

  /** Private binders are for their owner only: everyone else gets the same 404 as for no binder. */
  async function visibleBinder(from: DbOrTx, id: number, viewer: Me | null): Promise<BinderRow> {
    const row = await from.selectFrom("binders").selectAll().where("id", "=", id).executeTakeFirst();
    if (!row || (row.visibility === "private" && row.owner_id !== viewer?.id)) throw notFound("That binder");
    return row;
  }

  async function ownBinder(from: DbOrTx, id: number, me: Me): Promise<BinderRow> {
    const row = await visibleBinder(from, id, me);
    if (row.owner_id !== me.id) throw new AppError("forbidden", "Only the owner can change this binder.", 403);
    return row;
  }

  async function summaries(rows: BinderRow[], viewer: Me | null): Promise<BinderSummary[]> {
    if (!rows.length) return [];
    const ids = rows.map((r) => r.id);
    const counts = await db
      .selectFrom("binder_items")
      .innerJoin("strips", "strips.id", "binder_items.strip_id")
      .select(["binder_items.binder_id", "strips.author_id", "strips.status"])
      .where("binder_items.binder_id", "in", ids)
      .execute();
    const covers = await db
      .selectFrom("binder_items")
      .innerJoin("strips", "strips.id", "binder_items.strip_id")
      .innerJoin("strip_inks", "strip_inks.strip_id", "strips.id")
      .innerJoin("inks", "inks.id", "strip_inks.ink_id")
      .select(["binder_items.binder_id", "binder_items.position", "strip_inks.position as ink_position", "inks.hex"])
      .where("binder_items.binder_id", "in", ids)
      .where("strips.status", "=", "published")
      .orderBy("binder_items.position")
      .orderBy("strip_inks.position")
      .execute();
    const owners = await db.selectFrom("profiles").select(["user_id", "name"]).where("user_id", "in", rows.map((r) => r.owner_id)).execute();
    return rows.map((r) => {
      const isOwner = viewer?.id === r.owner_id;
      return {
        id: r.id,
        name: r.name,
        description: r.description,
        visibility: r.visibility,
        itemCount: counts.filter((c) => c.binder_id === r.id && (isOwner || c.status === "published")).length,
        owner: { id: r.owner_id, name: owners.find((o) => o.user_id === r.owner_id)?.name ?? "A member" },
        cover: [...new Set(covers.filter((c) => c.binder_id === r.id).map((c) => c.hex))].slice(0, 8),
        createdAt: r.created_at,
        updatedAt: r.updated_at,
      };
    });
  }

  return {
    async mine(me: Me) {
      const rows = await db.selectFrom("binders").selectAll().where("owner_id", "=", me.id).orderBy("updated_at", "desc").execute();
      return summaries(rows, me);
    },

    async publicOf(memberId: string, viewer: Me | null) {
      const rows = await db
        .selectFrom("binders")
        .selectAll()
        .where("owner_id", "=", memberId)
        .$if(viewer?.id !== memberId, (qb) => qb.where("visibility", "=", "public"))
        .orderBy("updated_at", "desc")
        .execute();
      return summaries(rows, viewer);
    },

    async create(me: Me, input: z.output<typeof binderInput>) {
      const now = nowIso();
      const row = await db
        .insertInto("binders")
        .values({ owner_id: me.id, name: input.name, description: input.description, visibility: input.visibility, created_at: now, updated_at: now })
        .returningAll()
        .executeTakeFirstOrThrow();
      return { ...(await summaries([row], me))[0]!, items: [], isOwner: true } satisfies Binder;
    },

    async get(id: number, viewer: Me | null): Promise<Binder> {
      const row = await visibleBinder(db, id, viewer);
      const isOwner = viewer?.id === row.owner_id;
      const items = await db.selectFrom("binder_items").selectAll().where("binder_id", "=", id).orderBy("position").execute();
      const stripRows = items.length ? await db.selectFrom("strips").selectAll().where("id", "in", items.map((i) => i.strip_id)).execute() : [];
      const strips = await hydrate(db, stripRows.filter((s) => s.status === "published"));
      const shown: BinderItem[] = [];
      for (const item of items) {
        const strip = strips.find((s) => s.id === item.strip_id);
        const base = { stripId: item.strip_id, position: item.position, note: item.note, addedAt: item.added_at };
        if (strip) shown.push({ ...base, available: true, strip });
        // A strip taken out of view stays listed for the owner only, as "no longer available".
        else if (isOwner) shown.push({ ...base, available: false, strip: null });
      }
      return { ...(await summaries([row], viewer))[0]!, items: shown, isOwner };
    },

    async update(id: number, me: Me, patch: z.output<typeof binderPatch>) {
      await ownBinder(db, id, me);
      await db.updateTable("binders").set({ ...patch, updated_at: nowIso() }).where("id", "=", id).execute();
      return this.get(id, me);
    },

    async remove(id: number, me: Me) {
      await db.transaction().execute(async (tx) => {
        await ownBinder(tx, id, me);
        const stripIds = (await tx.selectFrom("binder_items").select("strip_id").where("binder_id", "=", id).execute()).map((r) => r.strip_id);
        await tx.deleteFrom("binders").where("id", "=", id).execute();
        for (const s of stripIds) await recountSaves(tx, s);
      });
    },

    async addItem(id: number, me: Me, input: z.output<typeof binderItemInput>) {
      if (isSuspended(me)) throw new AppError("suspended", "Your account is suspended; you cannot save strips for now.", 403);
      return db.transaction().execute(async (tx) => {
        await ownBinder(tx, id, me);
        const strip = await tx.selectFrom("strips").select(["id", "status"]).where("id", "=", input.stripId).executeTakeFirst();
        if (!strip || strip.status !== "published") {
          throw new AppError("unknown_strip", "Only published strips can be saved.", 422, { stripId: ["is not a published strip"] });
        }
        const existing = await tx.selectFrom("binder_items").select("strip_id").where("binder_id", "=", id).where("strip_id", "=", input.stripId).executeTakeFirst();
        if (existing) throw new AppError("already_saved", "This strip is already in that binder.", 409);
        const { n, top } = await tx
          .selectFrom("binder_items")
          .select((eb) => [eb.fn.countAll<number>().as("n"), eb.fn.max("position").as("top")])
          .where("binder_id", "=", id)
          .executeTakeFirstOrThrow();
        if (Number(n) >= MAX_BINDER_ITEMS) throw new AppError("binder_full", `A binder holds at most ${MAX_BINDER_ITEMS} strips.`, 422);
        const now = nowIso();
        await tx.insertInto("binder_items").values({ binder_id: id, strip_id: input.stripId, position: top === null ? 0 : Number(top) + 1, note: input.note, added_at: now }).execute();
        await tx.updateTable("binders").set({ updated_at: now }).where("id", "=", id).execute();
        await recountSaves(tx, input.stripId);
        return { binderId: id, stripId: input.stripId };
      });
    },

    async updateItem(id: number, stripId: number, me: Me, note: string) {
      await ownBinder(db, id, me);
      const r = await db.updateTable("binder_items").set({ note }).where("binder_id", "=", id).where("strip_id", "=", stripId).executeTakeFirst();
      if (!Number(r.numUpdatedRows)) throw notFound("That strip in this binder");
    },

    async removeItem(id: number, stripId: number, me: Me) {
      await db.transaction().execute(async (tx) => {
        await ownBinder(tx, id, me);
        const r = await tx.deleteFrom("binder_items").where("binder_id", "=", id).where("strip_id", "=", stripId).executeTakeFirst();
        if (!Number(r.numDeletedRows)) throw notFound("That strip in this binder");
        await recountSaves(tx, stripId);
      });
    },

    /** Sets the order; the list must name exactly the binder's strips. */
    async reorder(id: number, me: Me, input: z.output<typeof binderOrderInput>) {
      await db.transaction().execute(async (tx) => {
        await ownBinder(tx, id, me);
        const current = (await tx.selectFrom("binder_items").select("strip_id").where("binder_id", "=", id).execute()).map((r) => r.strip_id);
        const given = new Set(input.stripIds);
        if (current.length !== given.size || current.some((s) => !given.has(s))) {
          throw new AppError("order_mismatch", "The new order must list exactly the strips in this binder.", 422, { stripIds: ["must list every strip in the binder once"] });
        }
        for (const [position, stripId] of input.stripIds.entries()) {
          await tx.updateTable("binder_items").set({ position }).where("binder_id", "=", id).where("strip_id", "=", stripId).execute();
        }
        await tx.updateTable("binders").set({ updated_at: nowIso() }).where("id", "=", id).execute();
      });
      return this.get(id, me);
    },

    /** Which of my binders hold this strip (for the save button). */
    async savedIn(me: Me, stripId: number) {
      const rows = await db
        .selectFrom("binder_items")
        .innerJoin("binders", "binders.id", "binder_items.binder_id")
        .select("binders.id")
        .where("binders.owner_id", "=", me.id)
        .where("binder_items.strip_id", "=", stripId)
        .execute();
      return rows.map((r) => r.id);
    },
  };
}
export type BindersService = ReturnType<typeof createBindersService>;
