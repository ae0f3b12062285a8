import type { InkType } from "../../../../shared/schemas/inks";
import { Badge } from "../../../components/ui/badge";
import { capitalise } from "../../../lib/format";

export function InkTypeBadge({ type }: { type: InkType }) {
  return <Badge tone={type === "dye" ? "accent" : "neutral"}>{capitalise(type)}</Badge>;
}

export function DiscontinuedBadge() {
  return <Badge tone="warning">Discontinued</Badge>;
}
