import { Link } from "react-router";

type PaginationProps = {
  page: number;
  pageSize: number;
  total: number;
  /** The link target (usually "?…") for a page number. */
  hrefFor: (page: number) => string;
  label?: string;
};

const linkClasses =
  "inline-flex min-h-11 min-w-11 items-center justify-center rounded-md border border-rule-strong bg-card px-4 font-bold text-ink hover:bg-paper-shade";
const disabledClasses =
  "inline-flex min-h-11 min-w-11 items-center justify-center rounded-md border border-rule px-4 font-bold text-ink-muted/70";

export function Pagination({ page, pageSize, total, hrefFor, label = "Pages" }: PaginationProps) {
  const pageCount = Math.max(1, Math.ceil(total / pageSize));
  if (pageCount <= 1) return null;
  const hasPrev = page > 1;
  const hasNext = page < pageCount;
  return (
    <nav aria-label={label} className="mt-8 flex items-center justify-between gap-3">
      {hasPrev ? (
        <Link to={hrefFor(page - 1)} className={linkClasses} rel="prev">
          <span aria-hidden="true">←</span>&nbsp;Previous
        </Link>
      ) : (
        <span className={disabledClasses} aria-disabled="true">
          <span aria-hidden="true">←</span>&nbsp;Previous
        </span>
      )}
      <p className="text-center text-ink-soft">
        Page <span className="font-bold text-ink tabular-nums">{page}</span> of{" "}
        <span className="tabular-nums">{pageCount}</span>
      </p>
      {hasNext ? (
        <Link to={hrefFor(page + 1)} className={linkClasses} rel="next">
          Next&nbsp;<span aria-hidden="true">→</span>
        </Link>
      ) : (
        <span className={disabledClasses} aria-disabled="true">
          Next&nbsp;<span aria-hidden="true">→</span>
        </span>
      )}
    </nav>
  );
}
