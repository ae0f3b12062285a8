import { statusLabels, type Strip, type StripStatus } from "../../../../shared/schemas/strips";
import { Badge, type BadgeTone } from "../../../components/ui/badge";
import { Notice, type NoticeTone } from "../../../components/ui/notice";

const badgeTones: Record<StripStatus, BadgeTone> = {
  published: "accent",
  pending: "neutral",
  returned: "warning",
  hidden: "warning",
  rejected: "strong",
};

export function StripStatusBadge({ status }: { status: StripStatus }) {
  return <Badge tone={badgeTones[status]}>{statusLabels[status]}</Badge>;
}

const banners: Record<Exclude<StripStatus, "published">, { tone: NoticeTone; body: string }> = {
  pending: {
    tone: "info",
    body: "This strip is waiting for review by a moderator. Until then only its author and the moderators can see it.",
  },
  returned: {
    tone: "warning",
    body: "A moderator returned this strip for edits. Once its author changes what they ask and saves, it goes back to the review queue.",
  },
  hidden: {
    tone: "warning",
    body: "A moderator has hidden this strip. Only its author and the moderators can see it; the author can still delete it.",
  },
  rejected: {
    tone: "error",
    body: "This strip was not accepted. Only its author and the moderators can see it; the author can delete it.",
  },
};

/** Why a strip is not (yet) public, for its author and moderators. */
export function StripStatusBanner({ strip }: { strip: Pick<Strip, "status" | "statusReason"> }) {
  if (strip.status === "published") return null;
  const banner = banners[strip.status];
  return (
    <Notice tone={banner.tone} title={statusLabels[strip.status]} className="mb-2">
      <p>{banner.body}</p>
      {strip.statusReason && (
        <p className="mt-2">
          <span className="font-bold text-ink">The moderator's reason:</span> {strip.statusReason}
        </p>
      )}
    </Notice>
  );
}
