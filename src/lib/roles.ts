import type { Role } from "../../shared/schemas/accounts";

/** Moderators and admins curate the ink catalogue. */
export function canModerate(role: Role | null | undefined): boolean {
  return role === "moderator" || role === "admin";
}

export function isAdmin(role: Role | null | undefined): boolean {
  return role === "admin";
}

const rank: Record<Role, number> = { member: 0, moderator: 1, admin: 2 };

/** True when `role` is `needed` or above it. */
export function hasRole(role: Role | null | undefined, needed: Role): boolean {
  return role !== null && role !== undefined && rank[role] >= rank[needed];
}

export const roleLabels: Record<Role, string> = {
  member: "Member",
  moderator: "Moderator",
  admin: "Admin",
};
