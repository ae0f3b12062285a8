import { infiniteQueryOptions, useInfiniteQuery } from "@tanstack/react-query";
import type { StripList } from "../../../../shared/schemas/strips";
import { api } from "../../../lib/api-client";
import { stripKeys, type StripListFilters } from "./keys";

export function getStrips(filters: StripListFilters & { cursor?: string }, signal?: AbortSignal): Promise<StripList> {
  return api.get<StripList>("/api/strips", { query: filters, signal });
}

export const stripsInfiniteQueryOptions = (filters: StripListFilters) =>
  infiniteQueryOptions({
    queryKey: stripKeys.list(filters),
    queryFn: ({ pageParam, signal }) => getStrips({ ...filters, cursor: pageParam }, signal),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (last) => last.nextCursor ?? undefined,
    // The list shows its own errors, including a failed "Load more".
    meta: { errorsShownInline: true },
  });

export function useStrips(filters: StripListFilters) {
  return useInfiniteQuery(stripsInfiniteQueryOptions(filters));
}
