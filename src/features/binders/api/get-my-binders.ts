import { queryOptions, useQuery } from "@tanstack/react-query";
import type { BinderSummary } from "../../../../shared/schemas/binders";
import { api, isApiError } from "../../../lib/api-client";
import { binderKeys } from "./keys";

/** My binders, newest change first; null for a visitor (401 is an answer here, not an error). */
export async function getMyBinders(signal?: AbortSignal): Promise<BinderSummary[] | null> {
  try {
    return (await api.get<{ items: BinderSummary[] }>("/api/binders", { signal })).items;
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export const myBindersQueryOptions = () =>
  queryOptions({
    queryKey: binderKeys.mine(),
    queryFn: ({ signal }) => getMyBinders(signal),
    // A visitor who signs in must not keep seeing "Sign in to save" from the cache.
    staleTime: (query) => (query.state.data === null ? 0 : 30_000),
  });

export function useMyBinders() {
  return useQuery(myBindersQueryOptions());
}
