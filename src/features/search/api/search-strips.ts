import { infiniteQueryOptions, keepPreviousData, useInfiniteQuery } from "@tanstack/react-query";
import type { StripSearchList } from "../../../../shared/schemas/search";
import { api } from "../../../lib/api-client";
import { searchApiQuery, type SearchState } from "../search-state";
import { searchKeys } from "./keys";

export const SEARCH_PAGE_SIZE = 12;

export function searchStrips(query: ReturnType<typeof searchApiQuery>, cursor: string | undefined, signal?: AbortSignal) {
  return api.get<StripSearchList>("/api/strips", { query: { ...query, cursor }, signal });
}

/** A stash search depends on who asks, so the viewer is part of the key. */
export const searchStripsQueryOptions = (search: SearchState, viewer: string | null) => {
  const query = searchApiQuery(search, SEARCH_PAGE_SIZE);
  return infiniteQueryOptions({
    queryKey: searchKeys.results(query, viewer),
    queryFn: ({ pageParam, signal }) => searchStrips(query, pageParam, signal),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (last) => last.nextCursor ?? undefined,
    // Keep the last results on screen while a changed search loads (no flash of "Loading").
    placeholderData: keepPreviousData,
    meta: { errorsShownInline: true },
  });
};

export function useSearchStrips(search: SearchState, viewer: string | null, enabled = true) {
  return useInfiniteQuery({ ...searchStripsQueryOptions(search, viewer), enabled });
}
