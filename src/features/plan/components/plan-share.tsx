import { useState } from "react";
import { Button } from "../../../components/ui/button";
import { PrintLinks } from "./print-links";

/** The plan's own address, to copy and share. */
export function PlanShare({ ids }: { ids: readonly number[] }) {
  const [copied, setCopied] = useState<"yes" | "failed" | null>(null);
  const url = `${window.location.origin}/plan?inks=${ids.join(",")}`;
  return (
    <div className="flex flex-col gap-2 border-t border-rule pt-4">
      <h3 className="font-bold">Share this plan</h3>
      <p className="text-sm break-all text-ink-soft" data-testid="plan-link">
        {url}
      </p>
      <Button
        variant="secondary"
        onClick={() => {
          if (!navigator.clipboard) return setCopied("failed");
          navigator.clipboard.writeText(url).then(
            () => setCopied("yes"),
            () => setCopied("failed"),
          );
        }}
      >
        Copy link
      </Button>
      <p role="status" className="text-sm text-ink-soft">
        {copied === "yes" ? "Link copied." : copied === "failed" ? "Could not copy: select the link above and copy it." : ""}
      </p>
      <PrintLinks href={`/api/plan/card.pdf?inks=${ids.join(",")}`} what="a practice card" />
    </div>
  );
}
