import { useCallback } from "react";
import { Link, useSearchParams } from "react-router";
import { ButtonLink } from "../../components/ui/button";
import { PageHeader } from "../../components/ui/page-header";
import { RequireRole } from "../../features/accounts/components/require-role";
import { logFiltersFromSearchParams, logFiltersToSearchParams, type LogFilters } from "../../features/review/log-filters";
import { ModerationLog } from "../../features/review/components/moderation-log";
import { ModerationLogFilters } from "../../features/review/components/moderation-log-filters";
import { ModeratorsOnly } from "../../features/review/components/moderators-only";
import { logActionLabel } from "../../features/review/review-words";
import { canModerate } from "../../lib/roles";

function describe(filters: LogFilters): string {
  const parts: string[] = [];
  if (filters.action) parts.push(`action “${logActionLabel(filters.action)}”`);
  if (filters.strip) parts.push(`strip #${filters.strip}`);
  if (filters.member) parts.push("one member");
  if (filters.moderator) parts.push("one moderator");
  return parts.length ? `Moderation log for ${parts.join(", ")}` : "Moderation log";
}

export default function ModerationLogPage() {
  const [searchParams, setSearchParams] = useSearchParams();
  const filters = logFiltersFromSearchParams(searchParams);
  const filtered = Boolean(filters.action || filters.strip || filters.member || filters.moderator);
  const update = useCallback((next: LogFilters) => setSearchParams(logFiltersToSearchParams(next)), [setSearchParams]);
  const title = describe(filters);

  return (
    <RequireRole>
      {(me) =>
        canModerate(me.role) ? (
          <>
            <PageHeader
              documentTitle={title}
              eyebrow="Moderation"
              title="Moderation log"
              intro="Every moderation action with who, when, why, and the state before and after. Nothing here can be edited or deleted."
              actions={
                <ButtonLink variant="secondary" to="/review">
                  Review queue
                </ButtonLink>
              }
            />
            <div className="flex flex-col gap-6">
              <ModerationLogFilters filters={filters} onChange={update} />
              {filtered && (
                <p className="flex flex-wrap items-center gap-x-3 gap-y-1 text-ink-soft">
                  <span>
                    Showing: <span className="font-bold text-ink">{title.replace(/^Moderation log for /, "")}</span>
                  </span>
                  <Link to="/moderation/log" className="font-bold text-accent underline">
                    Show everything
                  </Link>
                </p>
              )}
              <ModerationLog filters={filters} caption={title} />
            </div>
          </>
        ) : (
          <ModeratorsOnly what="The moderation log" />
        )
      }
    </RequireRole>
  );
}
