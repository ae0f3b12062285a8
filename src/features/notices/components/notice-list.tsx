import { Link } from "react-router";
import type { Notice } from "../../../../shared/schemas/moderation";
import { formatDateTime } from "../../../lib/format";

/** A member's notices, newest first; unread ones stand out by a mark, a word and weight, not colour alone. */
export function NoticeList({ notices }: { notices: Notice[] }) {
  return (
    <ol className="flex flex-col gap-3">
      {notices.map((n) => {
        const unread = n.readAt === null;
        return (
          <li key={n.id}>
            <article
              aria-label={`${unread ? "Unread: " : ""}${n.title}`}
              className={`rounded-xl border p-4 sm:p-5 ${unread ? "border-accent/50 border-l-4 border-l-accent bg-card shadow-card" : "border-rule bg-paper/60"}`}
            >
              <header className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
                {unread && (
                  <span className="inline-flex items-center rounded-full bg-accent px-2 py-0.5 text-xs font-bold tracking-wide text-card uppercase">
                    New
                  </span>
                )}
                <h2 className={`text-lg leading-tight ${unread ? "font-bold" : "font-bold text-ink-soft"}`}>{n.title}</h2>
                <time dateTime={n.createdAt} className="text-sm text-ink-muted tabular-nums sm:ml-auto">
                  {formatDateTime(n.createdAt)}
                </time>
              </header>
              <p className="mt-2 whitespace-pre-line text-ink-soft">{n.body}</p>
              {n.stripId !== null && (
                <p className="mt-2">
                  <Link to={`/strips/${n.stripId}`} className="font-bold text-accent underline">
                    Open the strip
                  </Link>
                </p>
              )}
            </article>
          </li>
        );
      })}
    </ol>
  );
}
