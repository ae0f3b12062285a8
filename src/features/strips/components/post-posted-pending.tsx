import { useEffect, useRef } from "react";
import { Button, ButtonLink } from "../../../components/ui/button";
import { Card } from "../../../components/ui/card";
import type { CreatedStrip } from "../api/create-strip";

/** After posting, for a strip that waits for review (a published one opens its own page instead). */
export function PostedPending({ result, onAnother }: { result: CreatedStrip; onAnother: () => void }) {
  const heading = useRef<HTMLHeadingElement>(null);
  // The form this replaces had the focus; start screen readers and keyboards at the news.
  useEffect(() => heading.current?.focus(), []);
  return (
    <Card className="max-w-2xl space-y-4" data-testid="posted-pending">
      <div aria-hidden="true" className="blend-ornament h-2 w-24 rounded-full" />
      <h2 ref={heading} tabIndex={-1} className="text-2xl font-bold">
        Your strip is waiting for review by a moderator
      </h2>
      <p className="text-ink-soft">
        New members' strips are checked by a moderator before everyone can see them. Until then, only you and the
        moderators can see it; you will find it under “Your strips”.
      </p>
      <div className="flex flex-wrap gap-3">
        <ButtonLink to={`/strips/${result.id}`}>See your strip</ButtonLink>
        <Button variant="secondary" onClick={onAnother}>
          Post another strip
        </Button>
      </div>
    </Card>
  );
}

