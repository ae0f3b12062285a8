import type { DbOrTx } from "../../db/client";
import type { NewProfile } from "../../db/schema";

export function findUserByEmail(db: DbOrTx, email: string) {
  return db.selectFrom("User").selectAll().where("email", "=", email).executeTakeFirst();
}

export function findAccountRow(db: DbOrTx, userId: string) {
  return db
    .selectFrom("User")
    .innerJoin("profiles", "profiles.user_id", "User.id")
    .leftJoin("passwords", "passwords.user_id", "User.id")
    .select([
      "User.id",
      "User.email",
      "profiles.name",
      "profiles.bio",
      "profiles.role",
      "profiles.standing",
      "profiles.suspended_until",
      "profiles.is_demo",
      "profiles.created_at",
      "passwords.hash as password_hash",
    ])
    .where("User.id", "=", userId)
    .executeTakeFirst();
}
export type AccountRow = NonNullable<Awaited<ReturnType<typeof findAccountRow>>>;

export function findProfile(db: DbOrTx, userId: string) {
  return db.selectFrom("profiles").selectAll().where("user_id", "=", userId).executeTakeFirst();
}

export async function insertProfileIfMissing(db: DbOrTx, profile: NewProfile) {
  await db.insertInto("profiles").values(profile).onConflict((oc) => oc.column("user_id").doNothing()).execute();
}

export async function updateProfile(db: DbOrTx, userId: string, patch: { name?: string; bio?: string }, now: string) {
  await db
    .updateTable("profiles")
    .set({ ...patch, updated_at: now })
    .where("user_id", "=", userId)
    .execute();
}

export function findPasswordHash(db: DbOrTx, userId: string) {
  return db.selectFrom("passwords").select("hash").where("user_id", "=", userId).executeTakeFirst();
}

export async function upsertPassword(db: DbOrTx, userId: string, hash: string, now: string) {
  await db
    .insertInto("passwords")
    .values({ user_id: userId, hash, updated_at: now })
    .onConflict((oc) => oc.column("user_id").doUpdateSet({ hash, updated_at: now }))
    .execute();
}

/** The reason a moderator gave for the member's latest suspension (the audit trail keeps it). */
export async function latestSuspensionReason(db: DbOrTx, userId: string): Promise<string | null> {
  const row = await db
    .selectFrom("moderation_actions")
    .select("reason")
    .where("member_id", "=", userId)
    .where("action", "=", "suspend")
    .orderBy("id", "desc")
    .executeTakeFirst();
  return row?.reason ?? null;
}
