import type { Me } from "../../../shared/schemas/accounts";
import { hashPassword, verifyPassword } from "../../auth/passwords";
import { nowIso, type Db } from "../../db/client";
import { AppError } from "../../middleware/errors";
import * as repo from "./accounts.repository";

export function displayNameFromEmail(email: string): string {
  const local = email.split("@")[0] ?? "member";
  const words = local.split(/[._-]+/).filter(Boolean);
  const name = words.map((w) => w[0]!.toUpperCase() + w.slice(1)).join(" ");
  return name.length >= 2 ? name.slice(0, 60) : "New member";
}

/** Every user gets a profile; users made by the sign-in adapter get theirs here. */
export async function ensureProfile(db: Db, user: { id: string; email: string; name?: string | null }) {
  const now = nowIso();
  await repo.insertProfileIfMissing(db, {
    user_id: user.id,
    name: user.name?.trim() || displayNameFromEmail(user.email),
    created_at: now,
    updated_at: now,
  });
}

export function toMe(row: repo.AccountRow): Me {
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    bio: row.bio,
    role: row.role,
    standing: row.standing,
    suspendedUntil: row.suspended_until,
    hasPassword: row.password_hash !== null,
    createdAt: row.created_at,
  };
}

export async function loadMe(db: Db, userId: string): Promise<Me | null> {
  let row = await repo.findAccountRow(db, userId);
  if (!row) {
    const user = await db.selectFrom("User").selectAll().where("id", "=", userId).executeTakeFirst();
    if (!user) return null;
    await ensureProfile(db, user);
    row = await repo.findAccountRow(db, userId);
  }
  return row ? toMe(row) : null;
}

export async function updateMe(db: Db, userId: string, patch: { name?: string; bio?: string }) {
  await repo.updateProfile(db, userId, patch, nowIso());
}

export async function setPassword(
  db: Db,
  userId: string,
  input: { currentPassword?: string; newPassword: string },
  demo: { isDemoAccount: boolean },
) {
  if (demo.isDemoAccount) {
    throw new AppError("demo_account", "Demo accounts keep the shared demo password.", 403);
  }
  const existing = await repo.findPasswordHash(db, userId);
  if (existing) {
    if (!input.currentPassword) {
      throw new AppError("invalid_request", "Some fields are not right.", 400, {
        currentPassword: ["is required to change your password"],
      });
    }
    if (!(await verifyPassword(input.currentPassword, existing.hash))) {
      throw new AppError("wrong_password", "Your current password is not right.", 422, {
        currentPassword: ["is not right"],
      });
    }
  }
  const hash = await hashPassword(input.newPassword);
  await repo.upsertPassword(db, userId, hash, nowIso());
}
