import { queryOptions, useQuery } from "@tanstack/react-query";
import type { Notice } from "../../../../shared/schemas/moderation";
import { api } from "../../../lib/api-client";
import { noticeKeys } from "./keys";

export type NoticeList = { items: Notice[] };

/** GET /api/notices: the signed-in member's notices, newest first (the latest 100). */
export function getNotices(signal?: AbortSignal): Promise<NoticeList> {
  return api.get<NoticeList>("/api/notices", { signal });
}

export const noticesQueryOptions = () =>
  queryOptions({
    queryKey: noticeKeys.list(),
    queryFn: ({ signal }) => getNotices(signal),
    staleTime: 15_000,
  });

export function useNotices() {
  return useQuery({ ...noticesQueryOptions(), refetchOnWindowFocus: true });
}

/**
 * How many notices are unread, for the header's badge. Pass `enabled` only when someone is
 * signed in (a visitor gets 401). Undefined while unknown.
 */
export function useUnreadNoticeCount(enabled = true): number | undefined {
  const { data } = useQuery({
    ...noticesQueryOptions(),
    enabled,
    refetchInterval: 120_000,
    refetchOnWindowFocus: true,
    select: (list) => list.items.filter((n) => n.readAt === null).length,
    meta: { errorsShownInline: true },
  });
  return enabled ? data : undefined;
}
