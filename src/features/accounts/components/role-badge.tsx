import type { Role } from "../../../../shared/schemas/accounts";
import { Badge } from "../../../components/ui/badge";
import { roleLabels } from "../../../lib/roles";

/** Members get no badge; moderators and admins are marked so people know who curates. */
export function RoleBadge({ role, always = false }: { role: Role; always?: boolean }) {
  if (role === "member" && !always) return null;
  return <Badge tone={role === "admin" ? "strong" : role === "moderator" ? "accent" : "neutral"}>{roleLabels[role]}</Badge>;
}
