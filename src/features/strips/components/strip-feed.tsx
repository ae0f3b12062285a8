import type { Strip } from "../../../../shared/schemas/strips";
import type { ReactNode } from "react";
import { Button } from "../../../components/ui/button";
import { LoadMoreButton } from "../../../components/ui/load-more-button";
import { Loading } from "../../../components/ui/loading";
import { Notice } from "../../../components/ui/notice";
import { errorMessage } from "../../../lib/api-client";
import type { StripListFilters } from "../api/keys";
import { useStrips } from "../api/get-strips";
import { StripList } from "./strip-list";

type StripFeedProps = {
  filters: StripListFilters;
  label: string;
  /** Shown when there are no strips at all. */
  empty: ReactNode;
  /** Offer "Load more" (cursor pages); off for short previews such as the home page's. */
  loadMore?: boolean;
  eagerCount?: number;
  actions?: (strip: Strip) => ReactNode;
};

/** Published strips from GET /api/strips, newest or most saved first, with "Load more". */
export function StripFeed({ filters, label, empty, loadMore = true, eagerCount = 2, actions }: StripFeedProps) {
  const strips = useStrips(filters);

  if (strips.isPending) return <Loading label="Loading strips…" />;
  if (strips.isLoadingError) {
    return (
      <Notice tone="error" title="The strips could not be loaded" live>
        <p>{errorMessage(strips.error)}</p>
        <Button variant="secondary" className="mt-3" onClick={() => void strips.refetch()}>
          Try again
        </Button>
      </Notice>
    );
  }

  const items = strips.data.pages.flatMap((p) => p.items);
  if (items.length === 0) return <>{empty}</>;

  return (
    <div className="flex flex-col gap-6" aria-busy={strips.isFetching}>
      <StripList strips={items} label={label} eagerCount={eagerCount} actions={actions} />
      {strips.isError && (
        <Notice tone="error" title={strips.isFetchNextPageError ? "More strips could not be loaded" : "The strips could not be updated"} live>
          <p>{errorMessage(strips.error)}</p>
        </Notice>
      )}
      {loadMore && strips.hasNextPage && <LoadMoreButton busy={strips.isFetchingNextPage} onClick={() => void strips.fetchNextPage()} />}
      {loadMore && !strips.hasNextPage && items.length > filters.limit && (
        <p className="text-center text-ink-muted">That is every strip here.</p>
      )}
    </div>
  );
}
