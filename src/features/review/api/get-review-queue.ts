import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ReviewQueueItem } from "../../../../shared/schemas/moderation";
import { api } from "../../../lib/api-client";
import { reviewKeys } from "./keys";

export type ReviewQueue = { items: ReviewQueueItem[] };

export function getReviewQueue(signal?: AbortSignal): Promise<ReviewQueue> {
  return api.get<ReviewQueue>("/api/review-queue", { signal });
}

export const reviewQueueQueryOptions = () =>
  queryOptions({
    queryKey: reviewKeys.queue(),
    queryFn: ({ signal }) => getReviewQueue(signal),
    // Several moderators work the same queue: keep it fresh.
    staleTime: 15_000,
    refetchOnWindowFocus: true,
    refetchInterval: 60_000,
  });

export function useReviewQueue() {
  return useQuery(reviewQueueQueryOptions());
}

/**
 * How many strips wait for a decision, for the header's badge (GET /api/review-queue/count, so
 * the badge never loads the queue itself). Pass `enabled` only for moderators and admins
 * (anyone else gets 403). Undefined while unknown.
 */
export function useReviewQueueCount(enabled: boolean): number | undefined {
  const { data } = useQuery({
    queryKey: reviewKeys.queueCount(),
    queryFn: ({ signal }) => api.get<{ count: number }>("/api/review-queue/count", { signal }),
    enabled,
    staleTime: 15_000,
    refetchOnWindowFocus: true,
    refetchInterval: 120_000,
    select: (answer) => answer.count,
    meta: { errorsShownInline: true },
  });
  return enabled ? data : undefined;
}
