import type { DbOrTx } from "../../db/client";

export async function insertSession(db: DbOrTx, row: { id: string; user_id: string; created_at: string; expires_at: string }) {
  await db
    .insertInto("member_sessions")
    .values({ ...row, last_seen_at: row.created_at })
    .execute();
}

/** The session with what deciding about it needs from the member's profile. */
export function findSession(db: DbOrTx, id: string) {
  return db
    .selectFrom("member_sessions")
    .innerJoin("profiles", "profiles.user_id", "member_sessions.user_id")
    .select([
      "member_sessions.id",
      "member_sessions.user_id",
      "member_sessions.last_seen_at",
      "member_sessions.expires_at",
      "member_sessions.ended_at",
      "profiles.role",
      "profiles.is_demo",
    ])
    .where("member_sessions.id", "=", id)
    .executeTakeFirst();
}

export async function touchSession(db: DbOrTx, id: string, now: string) {
  await db.updateTable("member_sessions").set({ last_seen_at: now }).where("id", "=", id).where("ended_at", "is", null).execute();
}

export async function endSession(db: DbOrTx, id: string, reason: string, now: string) {
  await db.updateTable("member_sessions").set({ ended_at: now, ended_reason: reason }).where("id", "=", id).where("ended_at", "is", null).execute();
}

/** Ends every open session of a member, but the one given in `except` (the member's own). */
export async function endSessionsOf(db: DbOrTx, userId: string, reason: string, now: string, except?: string) {
  let q = db.updateTable("member_sessions").set({ ended_at: now, ended_reason: reason }).where("user_id", "=", userId).where("ended_at", "is", null);
  if (except) q = q.where("id", "!=", except);
  const result = await q.executeTakeFirst();
  return Number(result.numUpdatedRows);
}

/** Rows of sessions that ended or ran out long ago are of no further use. */
export async function deleteSessionsBefore(db: DbOrTx, cutoff: string) {
  const result = await db
    .deleteFrom("member_sessions")
    .where((eb) => eb.or([eb("expires_at", "<", cutoff), eb("ended_at", "<", cutoff)]))
    .executeTakeFirst();
  return Number(result.numDeletedRows);
}
