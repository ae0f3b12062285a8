import { Button } from "../../../components/ui/button";
import { Loading } from "../../../components/ui/loading";
import { Notice } from "../../../components/ui/notice";
import { errorMessage } from "../../../lib/api-client";
import { plural } from "../../../lib/format";
import { useModerationLog } from "../api/get-moderation-log";
import type { LogFilters } from "../log-filters";
import { ModerationLogTable } from "./moderation-log-table";

/** The filtered audit trail with "Load older" paging. */
export function ModerationLog({ filters, caption }: { filters: LogFilters; caption: string }) {
  const log = useModerationLog(filters);

  if (log.isPending) return <Loading label="Loading the moderation log…" />;
  // A failed "load older" keeps the entries already shown; only a failed first load replaces them.
  if (!log.data) {
    return (
      <Notice tone="error" title="The moderation log could not be loaded" live>
        <p>{errorMessage(log.error)}</p>
        <Button variant="secondary" className="mt-3" onClick={() => void log.refetch()}>
          Try again
        </Button>
      </Notice>
    );
  }

  const entries = log.data.pages.flatMap((p) => p.items);
  if (entries.length === 0) {
    return (
      <Notice title="Nothing recorded">
        <p>No moderation action matches these filters.</p>
      </Notice>
    );
  }

  return (
    <div className="flex flex-col gap-4">
      <p className="text-ink-soft" aria-live="polite">
        Showing the latest {plural(entries.length, "entry", "entries")}
        {log.hasNextPage ? "; older ones follow" : ", all there are"}.
      </p>
      <ModerationLogTable entries={entries} caption={caption} />
      {log.hasNextPage && (
        <div>
          <Button variant="secondary" busy={log.isFetchingNextPage} busyLabel="Loading older entries…" onClick={() => void log.fetchNextPage()}>
            Load older entries
          </Button>
        </div>
      )}
      {log.isFetchNextPageError && (
        <Notice tone="error" live title="Older entries could not be loaded">
          <p>{errorMessage(log.failureReason)}</p>
        </Notice>
      )}
    </div>
  );
}
