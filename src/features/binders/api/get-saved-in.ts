import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "../../../lib/api-client";
import { binderKeys } from "./keys";

/** The ids of my binders that hold this strip. */
export async function getSavedIn(stripId: number, signal?: AbortSignal): Promise<number[]> {
  return (await api.get<{ binderIds: number[] }>(`/api/strips/${stripId}/saved-in`, { signal })).binderIds;
}

export const savedInQueryOptions = (stripId: number) =>
  queryOptions({
    queryKey: binderKeys.savedIn(stripId),
    queryFn: ({ signal }) => getSavedIn(stripId, signal),
  });

export function useSavedIn(stripId: number, enabled = true) {
  return useQuery({ ...savedInQueryOptions(stripId), enabled, meta: { errorsShownInline: true } });
}
