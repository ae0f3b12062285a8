import type { ReactNode } from "react";
import { Link } from "react-router";
import type { Strip } from "../../../../shared/schemas/strips";
import { formatDate, plural } from "../../../lib/format";
import { StripBandImage } from "./strip-band-image";
import { StripInkChips } from "./strip-ink-chips";
import { StripStatusBadge } from "./strip-status";

type StripRowProps = {
  strip: Strip;
  /** Show the status badge and reason (the author's own profile). */
  showStatus?: boolean;
  /** Leave out the author (on the author's own profile). */
  hideAuthor?: boolean;
  eager?: boolean;
  headingLevel?: 2 | 3;
  /** Controls from other features (e.g. saving to a binder), placed under the row's facts. */
  actions?: ReactNode;
  /** Lines above the ink chips, from the page (e.g. the band that matched a colour search). */
  details?: ReactNode;
};

/** One strip as a full-width band: the photo, then its ink chips, author, date and saves. */
export function StripRow({ strip, showStatus = false, hideAuthor = false, eager = false, headingLevel = 3, actions, details }: StripRowProps) {
  const Heading = headingLevel === 2 ? "h2" : "h3";
  const date = strip.publishedAt ?? strip.createdAt;
  return (
    <article
      className="group relative flex flex-col gap-3 rounded-xl border border-rule bg-card p-2.5 shadow-card transition-shadow hover:shadow-lifted has-[a.strip-link:focus-visible]:outline-3 has-[a.strip-link:focus-visible]:outline-offset-2 has-[a.strip-link:focus-visible]:outline-accent sm:p-3"
      data-testid="strip-row"
    >
      <StripBandImage strip={strip} eager={eager} />
      <div className="flex flex-col gap-2.5 px-1 pb-1">
        <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
          <Heading className="text-lg leading-snug font-bold">
            {/* The photo and the card are clickable too; the link's name stays the title. */}
            <Link
              to={`/strips/${strip.id}`}
              className="strip-link rounded-sm group-hover:underline before:absolute before:inset-0 before:rounded-xl focus-visible:outline-none"
            >
              {strip.title}
            </Link>
          </Heading>
          <p className="flex flex-wrap items-center gap-x-2 text-sm text-ink-soft">
            {!hideAuthor && (
              <>
                <span>
                  by{" "}
                  <Link to={`/members/${strip.author.id}`} className="relative z-10 font-bold text-accent hover:underline">
                    {strip.author.name}
                  </Link>
                </span>
                <span aria-hidden="true">·</span>
              </>
            )}
            <time dateTime={date}>{formatDate(date)}</time>
            <span aria-hidden="true">·</span>
            <span>{plural(strip.saves, "save")}</span>
          </p>
        </div>
        {actions && <div className="relative z-10 flex flex-wrap items-center gap-2">{actions}</div>}
        {showStatus && strip.status !== "published" && (
          <div className="flex flex-wrap items-center gap-2 text-sm">
            <StripStatusBadge status={strip.status} />
            {strip.statusReason && <span className="text-ink-soft">Reason: {strip.statusReason}</span>}
          </div>
        )}
        {details}
        <StripInkChips inks={strip.inks} label={`Inks of ${strip.title}, in order`} />
      </div>
    </article>
  );
}
