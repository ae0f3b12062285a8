import { queryOptions, useQuery } from "@tanstack/react-query";
import type { LookAlikeList } from "../../../../shared/schemas/search";
import { api } from "../../../lib/api-client";
import { inkKeys } from "./keys";

/** Catalogue inks within ΔE2000 5 of an ink, closest first; a member's answer marks the inks they own. */
export function getLookAlikes(id: number, signal?: AbortSignal): Promise<LookAlikeList> {
  return api.get<LookAlikeList>(`/api/inks/${id}/look-alikes`, { signal });
}

export const lookAlikesQueryOptions = (id: number, viewerId: string | null) =>
  queryOptions({
    queryKey: inkKeys.lookAlikes(id, viewerId),
    queryFn: ({ signal }) => getLookAlikes(id, signal),
    // The stash page changes what a member owns without touching this answer: ask again each
    // time a member opens an ink page. A visitor's answer changes only with the catalogue.
    staleTime: viewerId === null ? 30_000 : 0,
  });

/**
 * `viewer` is the signed-in member, null for a visitor, or undefined while that is not known
 * yet; the query waits for it so a member never sees (or caches) a visitor's answer.
 */
export function useLookAlikes(id: number, viewer: { id: string } | null | undefined) {
  return useQuery({ ...lookAlikesQueryOptions(id, viewer?.id ?? null), enabled: viewer !== undefined });
}
