import type { z } from "zod";
import type { Me } from "../../../shared/schemas/accounts";
import {
  actionFrom,
  type bulkDecisionInput,
  type decisionInput,
  type inkCorrectionInput,
  type ModerationLogEntry,
  type moderationLogQuery,
  type QueueReason,
  type ReviewQueueItem,
  type reportInput,
  type roleInput,
  type standingInput,
  type suspensionInput,
} from "../../../shared/schemas/moderation";
import type { Analysis } from "../../../shared/schemas/uploads";
import { nowIso, type Db, type DbOrTx } from "../../db/client";
import type { Database, StripRow } from "../../db/schema";
import type { ExpressionBuilder } from "kysely";
import { AppError, notFound } from "../../middleware/errors";
import * as stripsRepo from "../strips/strips.repository";
import { bandsOf, hydrate, isSuspended, tagBands } from "../strips/strips.service";
import { assertMayActOn } from "../../auth/role-rules";
import { endSessionsOf } from "../../auth/sessions";
import { notify } from "./notify";

type Decision = z.output<typeof decisionInput>;

/** Open reports from this many different members hold a strip out of view. */
export const REPORTS_TO_HOLD = 3;
/** Tagged inks further than this from their band are flagged for moderators (ΔE2000; ours). */
export const FAR_BAND_DE = 8;

const nextStatus: Record<Decision["action"], StripRow["status"]> = {
  approve: "published",
  return: "returned",
  hide: "hidden",
  reject: "rejected",
  restore: "published",
};

const noticeText: Record<Decision["action"], (title: string) => { title: string; body: string }> = {
  approve: (t) => ({ title: `"${t}" is published`, body: `A moderator approved your strip "${t}". It is now in the gallery.` }),
  return: (t) => ({ title: `"${t}" needs a few edits`, body: `A moderator returned your strip "${t}" for edits. Fix it and save to send it back for review.` }),
  hide: (t) => ({ title: `"${t}" was hidden`, body: `A moderator hid your strip "${t}" from the gallery.` }),
  reject: (t) => ({ title: `"${t}" was not accepted`, body: `A moderator did not accept your strip "${t}".` }),
  restore: (t) => ({ title: `"${t}" is back in the gallery`, body: `A moderator restored your strip "${t}".` }),
};

function reasonText(reason: string, note: string) {
  return note ? `${reason}: ${note}` : reason;
}

async function audit(
  db: DbOrTx,
  e: { moderatorId: string | null; action: string; stripId?: number | null; memberId?: string | null; reason: string; note?: string; before?: string | null; after?: string | null; detail?: unknown },
) {
  await db
    .insertInto("moderation_actions")
    .values({
      moderator_id: e.moderatorId,
      action: e.action,
      strip_id: e.stripId ?? null,
      member_id: e.memberId ?? null,
      reason: e.reason,
      note: e.note ?? "",
      before_state: e.before ?? null,
      after_state: e.after ?? null,
      detail_json: e.detail === undefined ? null : JSON.stringify(e.detail),
      created_at: nowIso(),
    })
    .execute();
}

async function authorRecord(db: DbOrTx, authorId: string) {
  const rows = await db
    .selectFrom("moderation_actions")
    .innerJoin("strips", "strips.id", "moderation_actions.strip_id")
    .select(["moderation_actions.action", "moderation_actions.created_at"])
    .where("strips.author_id", "=", authorId)
    .where("moderation_actions.action", "in", ["approve", "hide"])
    .execute();
  return {
    approved: rows.filter((r) => r.action === "approve").length,
    hidden: rows.filter((r) => r.action === "hide").length,
    hiddenSince: (since: string) => rows.some((r) => r.action === "hide" && r.created_at >= since),
  };
}

/** Three approved strips and nothing hidden in the last 30 days make a member trusted. */
async function maybeTrust(db: DbOrTx, authorId: string, appUrl: string) {
  const profile = await db.selectFrom("profiles").select(["standing"]).where("user_id", "=", authorId).executeTakeFirst();
  if (!profile || profile.standing === "trusted") return;
  const record = await authorRecord(db, authorId);
  const monthAgo = new Date(Date.now() - 30 * 24 * 60 * 60 * 1000).toISOString();
  if (record.approved >= 3 && !record.hiddenSince(monthAgo)) {
    await db.updateTable("profiles").set({ standing: "trusted", updated_at: nowIso() }).where("user_id", "=", authorId).execute();
    await audit(db, { moderatorId: null, action: "trust", memberId: authorId, reason: "three strips approved", before: "new", after: "trusted" });
    await notify(db, { userId: authorId }, { kind: "standing", stripId: null, title: "You are now a trusted member", body: "Your strips are now published without waiting for review. Thank you for posting with care." }, appUrl);
  }
}

/** In the review queue: pending, held after reports, or published with open reports. */
const inQueue = (eb: ExpressionBuilder<Database, "strips">) =>
  eb.or([
    eb("status", "=", "pending"),
    eb.and([eb("status", "=", "hidden"), eb("hold", "=", "reports")]),
    eb.and([
      eb("status", "=", "published"),
      eb.exists(eb.selectFrom("reports").select("reports.id").whereRef("reports.strip_id", "=", "strips.id").where("reports.status", "=", "open")),
    ]),
  ]);

export function createModerationService(deps: { db: Db; appUrl: string }) {
  const { db, appUrl } = deps;

  async function decideIn(tx: DbOrTx, mod: Me, stripId: number, d: Decision) {
    const row = await stripsRepo.findStrip(tx, stripId);
    if (!row) throw notFound("That strip");
    if (row.version !== d.expectedVersion) {
      throw new AppError("already_decided", `This strip changed since you opened it (it is now ${row.status}). Reload to see the latest.`, 409);
    }
    if (!actionFrom[d.action].includes(row.status)) {
      throw new AppError("not_allowed_now", `A ${row.status} strip cannot be given "${d.action}".`, 409);
    }
    const status = nextStatus[d.action];
    const now = nowIso();
    await stripsRepo.updateStrip(tx, stripId, {
      status,
      status_reason: status === "published" ? null : reasonText(d.reason, d.note),
      hold: null,
      version: row.version + 1,
      updated_at: now,
      published_at: status === "published" ? (row.published_at ?? now) : row.published_at,
    });
    await audit(tx, { moderatorId: mod.id, action: d.action, stripId, memberId: row.author_id, reason: d.reason, note: d.note, before: row.status, after: status });

    const open = await tx.selectFrom("reports").select(["id", "reporter_id"]).where("strip_id", "=", stripId).where("status", "=", "open").execute();
    if (open.length) {
      await tx.updateTable("reports").set({ status: "handled", handled_at: now }).where("id", "in", open.map((r) => r.id)).execute();
      for (const r of open) {
        await notify(tx, { userId: r.reporter_id }, { kind: "report-handled", stripId: null, title: "Your report was handled", body: `A moderator looked at the strip "${row.title}" that you reported and made a decision. Thank you for helping.` }, appUrl);
      }
    }
    const text = noticeText[d.action](row.title);
    const why = d.action === "approve" || d.action === "restore" ? "" : `\n\nReason: ${reasonText(d.reason, d.note)}`;
    await notify(tx, { userId: row.author_id }, { kind: `strip-${d.action}`, stripId, title: text.title, body: text.body + why }, appUrl);
    if (d.action === "approve") await maybeTrust(tx, row.author_id, appUrl);
    return { id: stripId, status, version: row.version + 1 };
  }

  return {
    decide(mod: Me, stripId: number, d: Decision) {
      return db.transaction().execute((tx) => decideIn(tx, mod, stripId, d));
    },

    /** Approves or hides several strips; each one stands alone (a stale one does not stop the rest). */
    async decideMany(mod: Me, input: z.output<typeof bulkDecisionInput>) {
      const results: { id: number; ok: boolean; status?: string; error?: string }[] = [];
      for (const item of input.items) {
        try {
          const r = await db.transaction().execute((tx) =>
            decideIn(tx, mod, item.id, { action: input.action, reason: input.reason, note: input.note, expectedVersion: item.expectedVersion }),
          );
          results.push({ id: item.id, ok: true, status: r.status });
        } catch (err) {
          if (!(err instanceof AppError)) throw err;
          results.push({ id: item.id, ok: false, error: err.message });
        }
      }
      return { results };
    },

    async correctInks(mod: Me, stripId: number, input: z.output<typeof inkCorrectionInput>) {
      return db.transaction().execute(async (tx) => {
        const row = await stripsRepo.findStrip(tx, stripId);
        if (!row) throw notFound("That strip");
        if (row.version !== input.expectedVersion) throw new AppError("already_decided", "This strip changed since you opened it. Reload to see the latest.", 409);
        const inks = await stripsRepo.findInksByIds(tx, input.inks);
        const missing = input.inks.filter((id) => !inks.some((i) => i.id === id));
        if (missing.length) throw new AppError("unknown_inks", "Some inks are not in the catalogue.", 422, { inks: [`unknown ink ids: ${missing.join(", ")}`] });
        const before = (await tx.selectFrom("strip_inks").select("ink_id").where("strip_id", "=", stripId).orderBy("position").execute()).map((r) => r.ink_id);
        await stripsRepo.replaceInks(tx, stripId, input.inks);
        const upload = await tx.selectFrom("uploads").select("analysis_json").where("id", "=", row.upload_id).executeTakeFirst();
        if (upload?.analysis_json) {
          const ordered = input.inks.map((id) => inks.find((i) => i.id === id)!);
          await stripsRepo.replaceBands(tx, stripId, tagBands(bandsOf(JSON.parse(upload.analysis_json) as Analysis, row.strip_index), ordered));
        }
        await stripsRepo.updateStrip(tx, stripId, { ink_count: input.inks.length, version: row.version + 1, updated_at: nowIso() });
        const names = input.inks.map((id) => inks.find((i) => i.id === id)!.name).join(", ");
        const beforeInks = await stripsRepo.findInksByIds(tx, before);
        const beforeNames = before.map((id) => beforeInks.find((i) => i.id === id)?.name ?? `ink #${id}`).join(", ");
        // The log shows the ink order before and after in words; the ids stay in detail.
        await audit(tx, { moderatorId: mod.id, action: "correct inks", stripId, memberId: row.author_id, reason: "ink tags corrected", note: input.note, before: beforeNames, after: names, detail: { before, after: input.inks } });
        await notify(tx, { userId: row.author_id }, { kind: "inks-corrected", stripId, title: `Ink tags corrected on "${row.title}"`, body: `A moderator corrected the inks of your strip "${row.title}". They are now: ${names}.${input.note ? `\n\nNote: ${input.note}` : ""}` }, appUrl);
        return { id: stripId, version: row.version + 1 };
      });
    },

    async report(member: Me, stripId: number, input: z.output<typeof reportInput>) {
      if (isSuspended(member)) throw new AppError("suspended", "Your account is suspended; you cannot report strips for now.", 403);
      return db.transaction().execute(async (tx) => {
        const row = await stripsRepo.findStrip(tx, stripId);
        if (!row || row.status !== "published") throw notFound("That strip");
        if (row.author_id === member.id) throw new AppError("own_strip", "You cannot report your own strip.", 422);
        const already = await tx.selectFrom("reports").select("id").where("strip_id", "=", stripId).where("reporter_id", "=", member.id).executeTakeFirst();
        if (already) throw new AppError("already_reported", "You already reported this strip. A moderator will look at it.", 409);
        await tx.insertInto("reports").values({ strip_id: stripId, reporter_id: member.id, reason: input.reason, note: input.note, created_at: nowIso() }).execute();
        const reporters = await tx
          .selectFrom("reports")
          .select((eb) => eb.fn.count<number>("reporter_id").distinct().as("n"))
          .where("strip_id", "=", stripId)
          .where("status", "=", "open")
          .executeTakeFirstOrThrow();
        let held = false;
        if (Number(reporters.n) >= REPORTS_TO_HOLD) {
          held = true;
          await stripsRepo.updateStrip(tx, stripId, { status: "hidden", hold: "reports", status_reason: "held while a moderator looks at reports", version: row.version + 1, updated_at: nowIso() });
          await audit(tx, { moderatorId: null, action: "hold", stripId, memberId: row.author_id, reason: `${REPORTS_TO_HOLD} open reports`, before: row.status, after: "hidden" });
        }
        await tx
          .insertInto("notices")
          .values({ user_id: member.id, kind: "report-received", strip_id: null, title: "Report received", body: `Thank you. A moderator will look at "${row.title}".`, created_at: nowIso() })
          .execute();
        return { received: true, held };
      });
    },

    /** How many strips wait for a decision (the header's badge), without loading them. */
    async queueCount(): Promise<number> {
      const row = await db.selectFrom("strips").select((eb) => eb.fn.countAll<number>().as("n")).where(inQueue).executeTakeFirstOrThrow();
      return Number(row.n);
    },

    async queue(): Promise<ReviewQueueItem[]> {
      const rows = await db
        .selectFrom("strips")
        .selectAll()
        .where(inQueue)
        .orderBy("updated_at")
        .limit(200)
        .execute();
      if (!rows.length) return [];
      const strips = await hydrate(db, rows);
      const ids = rows.map((r) => r.id);
      const reports = await db.selectFrom("reports").selectAll().where("strip_id", "in", ids).where("status", "=", "open").orderBy("created_at").execute();
      const profiles = await db.selectFrom("profiles").select(["user_id", "name", "standing"]).where("user_id", "in", rows.map((r) => r.author_id)).execute();
      const uploads = await db.selectFrom("uploads").select(["id", "analysis_json"]).where("id", "in", rows.map((r) => r.upload_id)).execute();
      const items: ReviewQueueItem[] = [];
      for (const row of rows) {
        const strip = strips.find((s) => s.id === row.id)!;
        const own = reports.filter((r) => r.strip_id === row.id);
        const reasons: QueueReason[] = [];
        if (row.status === "pending") reasons.push(row.hold === "duplicate" ? "possible duplicate" : row.version > 1 ? "edited, back to review" : "new member");
        if (row.status === "hidden" && row.hold === "reports") reasons.push("held: reports");
        if (row.status === "published" && own.length) reasons.push("reported");
        const profile = profiles.find((p) => p.user_id === row.author_id);
        const record = await authorRecord(db, row.author_id);
        const analysis = uploads.find((u) => u.id === row.upload_id)?.analysis_json;
        const parsed = analysis ? (JSON.parse(analysis) as Analysis) : null;
        const duplicates = row.duplicate_of ? await db.selectFrom("strips").select(["id", "title", "status"]).where("id", "=", row.duplicate_of).execute() : [];
        items.push({
          strip,
          reasons,
          waitingSince: own[0]?.created_at && row.status === "published" ? own[0].created_at : row.updated_at,
          author: { id: row.author_id, name: profile?.name ?? "A member", standing: profile?.standing ?? "new", approved: record.approved, hidden: record.hidden },
          reports: own.map((r) => ({ reason: r.reason, note: r.note, createdAt: r.created_at })),
          duplicates,
          farBands: strip.bands.filter((b) => (b.deltaE ?? 0) > FAR_BAND_DE).map((b) => b.index),
          suggestions: parsed ? bandsOf(parsed, row.strip_index).map((b) => ({ bandIndex: b.index, inks: b.suggestions.slice(0, 3) })) : [],
        });
      }
      return items;
    },

    async setStanding(mod: Me, memberId: string, input: z.output<typeof standingInput>) {
      return db.transaction().execute(async (tx) => {
        const profile = await tx.selectFrom("profiles").selectAll().where("user_id", "=", memberId).executeTakeFirst();
        if (!profile) throw notFound("That member");
        assertMayActOn(mod, { id: memberId, role: profile.role }, "set standing");
        await tx.updateTable("profiles").set({ standing: input.standing, updated_at: nowIso() }).where("user_id", "=", memberId).execute();
        await audit(tx, { moderatorId: mod.id, action: input.standing === "trusted" ? "trust" : "untrust", memberId, reason: input.reason, before: profile.standing, after: input.standing });
        return { id: memberId, standing: input.standing };
      });
    },

    async suspend(mod: Me, memberId: string, input: z.output<typeof suspensionInput>) {
      return db.transaction().execute(async (tx) => {
        const profile = await tx.selectFrom("profiles").selectAll().where("user_id", "=", memberId).executeTakeFirst();
        if (!profile) throw notFound("That member");
        assertMayActOn(mod, { id: memberId, role: profile.role }, "suspend");
        const until = input.days === 0 ? null : new Date(Date.now() + input.days * 24 * 60 * 60 * 1000).toISOString();
        await tx.updateTable("profiles").set({ suspended_until: until, updated_at: nowIso() }).where("user_id", "=", memberId).execute();
        // A suspension ends the member's sessions (ASVS 5.0 V7.4.2); signing in again gives a read-only account.
        if (until) await endSessionsOf(tx, memberId, "suspended");
        await audit(tx, { moderatorId: mod.id, action: until ? "suspend" : "lift suspension", memberId, reason: input.reason, before: profile.suspended_until, after: until });
        await notify(
          tx,
          { userId: memberId },
          until
            ? { kind: "suspended", stripId: null, title: "Your account is suspended", body: `You cannot post, report or save strips until ${until.slice(0, 10)}.\n\nReason: ${input.reason}` }
            : { kind: "unsuspended", stripId: null, title: "Your suspension is lifted", body: "You can post, report and save strips again." },
          appUrl,
        );
        return { id: memberId, suspendedUntil: until };
      });
    },

    async setRole(admin: Me, memberId: string, input: z.output<typeof roleInput>) {
      return db.transaction().execute(async (tx) => {
        const profile = await tx.selectFrom("profiles").selectAll().where("user_id", "=", memberId).executeTakeFirst();
        if (!profile) throw notFound("That member");
        assertMayActOn(admin, { id: memberId, role: profile.role }, "change role");
        await tx.updateTable("profiles").set({ role: input.role, updated_at: nowIso() }).where("user_id", "=", memberId).execute();
        // Sessions begun under the old role end with it.
        await endSessionsOf(tx, memberId, "role changed");
        await audit(tx, { moderatorId: admin.id, action: "change role", memberId, reason: input.reason, before: profile.role, after: input.role });
        return { id: memberId, role: input.role };
      });
    },

    async log(q: z.output<typeof moderationLogQuery>): Promise<{ items: ModerationLogEntry[]; nextBefore: number | null }> {
      let query = db
        .selectFrom("moderation_actions as m")
        .leftJoin("profiles as mod", "mod.user_id", "m.moderator_id")
        .leftJoin("strips as s", "s.id", "m.strip_id")
        .leftJoin("profiles as mem", "mem.user_id", "m.member_id")
        .select([
          "m.id", "m.moderator_id", "mod.name as moderator_name", "m.action", "m.strip_id", "s.title as strip_title",
          "m.member_id", "mem.name as member_name", "m.reason", "m.note", "m.before_state", "m.after_state", "m.created_at",
        ]);
      if (q.strip) query = query.where("m.strip_id", "=", q.strip);
      if (q.member) query = query.where((eb) => eb.or([eb("m.member_id", "=", q.member!), eb("s.author_id", "=", q.member!)]));
      if (q.moderator) query = query.where("m.moderator_id", "=", q.moderator);
      if (q.action) query = query.where("m.action", "=", q.action);
      if (q.before) query = query.where("m.id", "<", q.before);
      const rows = await query.orderBy("m.id", "desc").limit(q.limit + 1).execute();
      const page = rows.slice(0, q.limit);
      return {
        items: page.map((r) => ({
          id: r.id,
          moderator: { id: r.moderator_id ?? "", name: r.moderator_id ? (r.moderator_name ?? "A moderator") : "Blendwell (automatic)" },
          action: r.action,
          strip: r.strip_id ? { id: r.strip_id, title: r.strip_title ?? "" } : null,
          member: r.member_id ? { id: r.member_id, name: r.member_name ?? "" } : null,
          reason: r.reason,
          note: r.note,
          before: r.before_state,
          after: r.after_state,
          createdAt: r.created_at,
        })),
        nextBefore: rows.length > q.limit ? page[page.length - 1]!.id : null,
      };
    },

    async notices(userId: string) {
      const rows = await db.selectFrom("notices").selectAll().where("user_id", "=", userId).orderBy("id", "desc").limit(100).execute();
      return rows.map((n) => ({ id: n.id, kind: n.kind, stripId: n.strip_id, title: n.title, body: n.body, createdAt: n.created_at, readAt: n.read_at }));
    },

    async markNoticesRead(userId: string) {
      await db.updateTable("notices").set({ read_at: nowIso() }).where("user_id", "=", userId).where("read_at", "is", null).execute();
    },
  };
}
export type ModerationService = ReturnType<typeof createModerationService>;
