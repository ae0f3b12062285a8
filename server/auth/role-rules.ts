import type { Me, Role } from "../../shared/schemas/accounts";
import { AppError } from "../middleware/errors";

/** What one account can do to another (the moderation routes under /api/members/:id). */
export const memberActions = ["set standing", "suspend", "change role"] as const;
export type MemberAction = (typeof memberActions)[number];

const everything = memberActions;

/**
 * The one table of who may act on whom: rows are the actor's role, columns the target's role.
 * From the brief's "People": moderators look after members (standing, suspension); admins can
 * do everything, roles included; nobody acts on a role above their own, so a moderator never
 * acts on a moderator or an admin. Every cell is tested in tests/server/role-rules.test.ts.
 */
export const roleRules: Record<Role, Record<Role, readonly MemberAction[]>> = {
  member: { member: [], moderator: [], admin: [] },
  moderator: { member: ["set standing", "suspend"], moderator: [], admin: [] },
  admin: { member: everything, moderator: everything, admin: everything },
};

export function mayActOn(actor: Role, target: Role, action: MemberAction): boolean {
  return roleRules[actor][target].includes(action);
}

/** Throws the member-facing refusal when the table says no (and for acting on oneself). */
export function assertMayActOn(actor: Pick<Me, "id" | "role">, target: { id: string; role: Role }, action: MemberAction) {
  if (actor.id === target.id && action !== "set standing") {
    throw new AppError("self", action === "suspend" ? "You cannot suspend yourself." : "You cannot change your own role.", 422);
  }
  if (!mayActOn(actor.role, target.role, action)) {
    const verb = action === "set standing" ? "change the standing of" : action === "suspend" ? "suspend" : "change the role of";
    const an = (role: Role) => (role === "admin" ? "an admin" : `a ${role}`);
    throw new AppError("forbidden", `As ${an(actor.role)}, you cannot ${verb} ${an(target.role)}.`, 403);
  }
}
