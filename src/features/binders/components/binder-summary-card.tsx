import type { ReactNode } from "react";
import { Link } from "react-router";
import type { BinderSummary } from "../../../../shared/schemas/binders";
import { formatDate, plural } from "../../../lib/format";
import { BinderCover } from "./binder-cover";
import { VisibilityBadge } from "./visibility-badge";

type BinderSummaryCardProps = {
  binder: BinderSummary;
  headingLevel?: 2 | 3;
  /** Show the owner's name (a list that mixes members). */
  showOwner?: boolean;
  /** Shown under the summary (the owner's edit and delete buttons). */
  actions?: ReactNode;
  children?: ReactNode;
};

/** One binder in a list: its colours as a band, then name, who can see it, size and description. */
export function BinderSummaryCard({ binder, headingLevel = 3, showOwner = false, actions, children }: BinderSummaryCardProps) {
  const Heading = headingLevel === 2 ? "h2" : "h3";
  return (
    <article className="flex flex-col gap-3 rounded-xl border border-rule bg-card p-3 shadow-card sm:p-4">
      {/* First on screen, after the name for screen readers. */}
      <BinderCover cover={binder.cover} className="-order-1" />
      <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <Heading className="min-w-0 text-lg leading-snug font-bold break-words">
          <Link to={`/binders/${binder.id}`} className="text-ink hover:text-accent hover:underline">
            {binder.name}
          </Link>
        </Heading>
        <p className="flex flex-wrap items-center gap-x-2 gap-y-1 text-sm text-ink-soft">
          <VisibilityBadge visibility={binder.visibility} />
          <span>{plural(binder.itemCount, "strip")}</span>
          {showOwner && (
            <>
              <span aria-hidden="true">·</span>
              <span>by {binder.owner.name}</span>
            </>
          )}
          <span aria-hidden="true">·</span>
          <span>
            changed <time dateTime={binder.updatedAt}>{formatDate(binder.updatedAt)}</time>
          </span>
        </p>
      </div>
      {binder.description && <p className="max-w-prose whitespace-pre-line break-words text-ink-soft">{binder.description}</p>}
      {actions && <div className="flex flex-wrap gap-2 border-t border-rule pt-3">{actions}</div>}
      {children}
    </article>
  );
}
