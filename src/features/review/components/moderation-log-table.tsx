import { Link } from "react-router";
import type { ModerationLogEntry } from "../../../../shared/schemas/moderation";
import { formatDateTime } from "../../../lib/format";
import { logActionLabel, stateWords } from "../review-words";

const cell = "block px-0 py-0.5 align-top sm:table-cell sm:px-3 sm:py-2.5";
// On a phone each entry is a small card; every cell says what it is.
const labelled = `${cell} before:mr-1.5 before:font-bold before:text-ink-muted before:content-[attr(data-label)] sm:before:content-none`;

function Change({ entry }: { entry: ModerationLogEntry }) {
  if (entry.before === null && entry.after === null) return <span className="text-ink-muted">—</span>;
  return (
    <span>
      {stateWords(entry.action, entry.before)} <span aria-hidden="true">→</span>
      <span className="sr-only">to</span> <span className="font-bold">{stateWords(entry.action, entry.after)}</span>
    </span>
  );
}

/** The audit trail, newest first. Read-only: nothing in it can be changed or removed. */
export function ModerationLogTable({ entries, caption }: { entries: ModerationLogEntry[]; caption: string }) {
  return (
    <table className="block w-full text-left sm:table sm:border-collapse">
      <caption className="sr-only">{caption}</caption>
      <thead className="hidden sm:table-header-group">
        <tr className="border-b-2 border-rule-strong text-sm text-ink-muted">
          <th scope="col" className="px-3 py-2">When</th>
          <th scope="col" className="px-3 py-2">Action</th>
          <th scope="col" className="px-3 py-2">Strip or member</th>
          <th scope="col" className="px-3 py-2">By</th>
          <th scope="col" className="px-3 py-2">Reason</th>
          <th scope="col" className="px-3 py-2">Before → after</th>
        </tr>
      </thead>
      <tbody className="flex flex-col gap-2 sm:table-row-group">
        {entries.map((e) => (
          <tr key={e.id} className="block rounded-lg border border-rule bg-card p-3 sm:table-row sm:rounded-none sm:border-0 sm:border-b sm:bg-transparent sm:p-0">
            <td data-label="When" className={`${labelled} whitespace-nowrap tabular-nums`}>
              <time dateTime={e.createdAt}>{formatDateTime(e.createdAt)}</time>
            </td>
            <td data-label="Action" className={`${labelled} font-bold`}>
              {logActionLabel(e.action)}
            </td>
            <td data-label="About" className={labelled}>
              {e.strip && (
                <span className="block">
                  <Link to={`/strips/${e.strip.id}`} className="font-bold text-accent underline">
                    {e.strip.title || `Strip #${e.strip.id}`}
                  </Link>{" "}
                  <span className="text-sm text-ink-muted">
                    #{e.strip.id} ·{" "}
                    <Link to={`/moderation/log?strip=${e.strip.id}`} className="underline">
                      history<span className="sr-only"> of strip #{e.strip.id}</span>
                    </Link>
                  </span>
                </span>
              )}
              {e.member && (
                <span className="block text-ink-soft">
                  {e.strip ? "by " : ""}
                  <Link to={`/members/${e.member.id}`} className="underline">
                    {e.member.name || "a member"}
                  </Link>{" "}
                  <Link to={`/moderation/log?member=${e.member.id}`} className="text-sm text-ink-muted underline">
                    history<span className="sr-only"> of {e.member.name || "this member"}</span>
                  </Link>
                </span>
              )}
            </td>
            <td data-label="By" className={labelled}>
              {e.moderator.id ? e.moderator.name : <span className="italic">{e.moderator.name || "Blendwell (automatic)"}</span>}
            </td>
            <td data-label="Reason" className={`${labelled} max-w-xs`}>
              {e.reason}
              {e.note && <span className="block text-ink-soft">“{e.note}”</span>}
            </td>
            <td data-label="Change" className={labelled}>
              <Change entry={e} />
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
