import { useEffect, useRef } from "react";
import { Link } from "react-router";
import { Button, ButtonLink } from "../../../components/ui/button";
import { Card } from "../../../components/ui/card";
import { plural } from "../../../lib/format";
import type { BatchResult } from "./batch-post-form";

type BatchPostedSummaryProps = {
  results: BatchResult[];
  memberId: string;
  /** Strips of this photo not posted yet (unticked or refused). */
  left: number;
  onAnother: () => void;
};

/** What a round of "Post N strips" did: published, waiting for review, or not posted and why. */
export function BatchPostedSummary({ results, memberId, left, onAnother }: BatchPostedSummaryProps) {
  const heading = useRef<HTMLHeadingElement>(null);
  // The button that started this had the focus; start keyboards and screen readers at the news.
  useEffect(() => heading.current?.focus(), [results]);
  const published = results.filter((r) => r.ok && r.status === "published");
  const pending = results.filter((r) => r.ok && r.status === "pending");
  const failed = results.filter((r) => !r.ok);
  const done = published.length + pending.length;
  return (
    <Card className="space-y-4" data-testid="batch-posted">
      <div aria-hidden="true" className="blend-ornament h-2 w-24 rounded-full" />
      <h2 ref={heading} tabIndex={-1} className="text-2xl font-bold">
        {done === 0 ? "No strip was posted" : `${plural(done, "strip")} posted`}
      </h2>
      {published.length > 0 && (
        <div>
          <h3 className="font-bold">Published in the gallery</h3>
          <ul className="list-disc pl-5" data-testid="batch-published">
            {published.map((r) => (
              <li key={r.index}>
                Strip {r.index + 1}: {r.ok && <Link to={`/strips/${r.id}`} className="font-bold text-accent underline">{r.title}</Link>}
              </li>
            ))}
          </ul>
        </div>
      )}
      {pending.length > 0 && (
        <div>
          <h3 className="font-bold">Waiting for review by a moderator</h3>
          <p className="text-sm text-ink-soft">Until then only you and the moderators can see them.</p>
          <ul className="list-disc pl-5" data-testid="batch-pending">
            {pending.map((r) => (
              <li key={r.index}>
                Strip {r.index + 1}: {r.ok && <Link to={`/strips/${r.id}`} className="font-bold text-accent underline">{r.title}</Link>}
              </li>
            ))}
          </ul>
        </div>
      )}
      {failed.length > 0 && (
        <div>
          <h3 className="font-bold text-danger">Not posted</h3>
          <ul className="list-disc pl-5" data-testid="batch-failed">
            {failed.map((r) => (
              <li key={r.index}>
                Strip {r.index + 1} ({r.title}): {!r.ok && r.message}
              </li>
            ))}
          </ul>
        </div>
      )}
      <p className="text-ink-soft">{left > 0 ? `${plural(left, "strip")} of this photo ${left === 1 ? "is" : "are"} not posted yet; they stay below as drafts for a week.` : "Every strip of this photo is posted."}</p>
      <div className="flex flex-wrap gap-3">
        <ButtonLink to={`/members/${memberId}`}>See your strips</ButtonLink>
        <Button variant="secondary" onClick={onAnother}>
          Post another photo
        </Button>
      </div>
    </Card>
  );
}
