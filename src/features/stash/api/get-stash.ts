import { queryOptions, useQuery } from "@tanstack/react-query";
import type { StashItem } from "../../../../shared/schemas/stash";
import { api, isApiError } from "../../../lib/api-client";
import { stashKeys } from "./keys";

/** My stash (sorted by brand, then name); null for a visitor (401 is an answer here, not an error). */
export async function getStash(signal?: AbortSignal): Promise<StashItem[] | null> {
  try {
    return (await api.get<{ items: StashItem[] }>("/api/stash", { signal })).items;
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export const stashQueryOptions = () =>
  queryOptions({
    queryKey: stashKeys.mine(),
    queryFn: ({ signal }) => getStash(signal),
    // A visitor who signs in must not keep the visitor's empty answer.
    staleTime: (query) => (query.state.data === null ? 0 : 30_000),
  });

export function useStash() {
  return useQuery(stashQueryOptions());
}
