import type { BinderSummary } from "../../../../shared/schemas/binders";
import { Badge } from "../../../components/ui/badge";

export const visibilityLabels: Record<BinderSummary["visibility"], string> = { private: "Private", public: "Public" };

export const visibilityHints: Record<BinderSummary["visibility"], string> = {
  private: "Only you can see it.",
  public: "Anyone with the link can see it, and it shows on your profile.",
};

export function VisibilityBadge({ visibility }: { visibility: BinderSummary["visibility"] }) {
  return <Badge tone={visibility === "public" ? "accent" : "neutral"}>{visibilityLabels[visibility]}</Badge>;
}
