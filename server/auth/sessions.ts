import { randomBytes } from "node:crypto";
import type { Role } from "../../shared/schemas/accounts";
import type { DbOrTx } from "../db/client";
import * as repo from "../modules/accounts/sessions.repository";

/*
 * Server-side sessions behind Auth.js's JWT cookie (docs/decisions/006-ending-sessions.md).
 * The JWT names a row in member_sessions; every request checks the row, so sign-out, "sign out
 * everywhere", a password change, a suspension or a role change end sessions at once
 * (OWASP ASVS 5.0, V7.4 session termination).
 */

/** Absolute lifetime, however active (ASVS 5.0 V7.3.2); also the cookie's maxAge. */
export const SESSION_MAX_AGE_S = 30 * 24 * 60 * 60;

/**
 * Inactivity timeout (ASVS 5.0 V7.3.1), by role: moderators and admins can hide strips and
 * suspend members, so their unattended sessions end sooner. Our own risk choice, see the note.
 */
export const IDLE_MS: Record<Role, number> = {
  member: 3 * 24 * 60 * 60 * 1000,
  moderator: 12 * 60 * 60 * 1000,
  admin: 12 * 60 * 60 * 1000,
};

/** last_seen_at is written at most this often, so reads do not each become a write. */
const TOUCH_EVERY_MS = 60 * 1000;

export async function startSession(db: DbOrTx, userId: string, now = new Date()): Promise<string> {
  const id = randomBytes(24).toString("base64url");
  await repo.insertSession(db, {
    id,
    user_id: userId,
    created_at: now.toISOString(),
    expires_at: new Date(now.getTime() + SESSION_MAX_AGE_S * 1000).toISOString(),
  });
  return id;
}

export type SessionCheck = { ok: true } | { ok: false; why: "unknown" | "ended" | "expired" | "idle" | "demo" };

/**
 * Is this session still good for this member? Renews its idle clock (sliding) when it is.
 * `demoAllowed` false refuses demo accounts' sessions (production never serves them).
 */
export async function checkSession(
  db: DbOrTx,
  sessionId: string,
  userId: string,
  opts: { demoAllowed: boolean; now?: Date },
): Promise<SessionCheck> {
  const now = opts.now ?? new Date();
  const row = await repo.findSession(db, sessionId);
  if (!row || row.user_id !== userId) return { ok: false, why: "unknown" };
  if (row.ended_at) return { ok: false, why: "ended" };
  if (row.is_demo && !opts.demoAllowed) return { ok: false, why: "demo" };
  if (Date.parse(row.expires_at) <= now.getTime()) {
    await repo.endSession(db, sessionId, "expired", now.toISOString());
    return { ok: false, why: "expired" };
  }
  const idleFor = now.getTime() - Date.parse(row.last_seen_at);
  if (idleFor > IDLE_MS[row.role]) {
    await repo.endSession(db, sessionId, "idle", now.toISOString());
    return { ok: false, why: "idle" };
  }
  if (idleFor > TOUCH_EVERY_MS) await repo.touchSession(db, sessionId, now.toISOString());
  return { ok: true };
}

export const endSession = (db: DbOrTx, sessionId: string, reason: string) => repo.endSession(db, sessionId, reason, new Date().toISOString());

/** Ends all of a member's sessions, or all but `except` (the session asking). */
export const endSessionsOf = (db: DbOrTx, userId: string, reason: string, except?: string) =>
  repo.endSessionsOf(db, userId, reason, new Date().toISOString(), except);

/** Forgets rows that ended or expired more than a week ago (hourly housekeeping). */
export const forgetOldSessions = (db: DbOrTx, now = new Date()) =>
  repo.deleteSessionsBefore(db, new Date(now.getTime() - 7 * 24 * 60 * 60 * 1000).toISOString());
