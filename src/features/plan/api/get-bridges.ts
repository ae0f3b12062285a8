import { queryOptions, useQuery } from "@tanstack/react-query";
import type { BridgeList } from "../../../../shared/schemas/plan";
import { api } from "../../../lib/api-client";
import { planKeys, type BridgeRequest } from "./keys";

export function getBridges(q: BridgeRequest, signal?: AbortSignal): Promise<BridgeList> {
  return api.get<BridgeList>("/api/bridges", {
    signal,
    query: { from: q.from, to: q.to, inks: q.inks, sameBrand: q.sameBrand ? "true" : undefined, limit: q.limit },
  });
}

/** The viewer is part of the key: the stash options answer differently for each member. */
export const bridgesQueryOptions = (q: BridgeRequest, viewerId: string | null) =>
  queryOptions({
    queryKey: planKeys.bridgeList(q, viewerId),
    queryFn: ({ signal }) => getBridges(q, signal),
    staleTime: 60_000,
  });

export function useBridges(q: BridgeRequest | null, viewerId: string | null) {
  return useQuery({
    ...bridgesQueryOptions(q ?? { from: 0, to: 0, inks: "any", sameBrand: false, limit: 5 }, viewerId),
    enabled: !!q,
    meta: { errorsShownInline: true },
  });
}
