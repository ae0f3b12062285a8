import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { NoticeList } from "./get-notices";
import { api } from "../../../lib/api-client";
import { noticeKeys } from "./keys";

/** POST /api/notices/read → 204: every unread notice is marked read now. */
export function markNoticesRead(): Promise<void> {
  return api.post<void>("/api/notices/read");
}

export function useMarkNoticesRead() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: markNoticesRead,
    onSuccess: () => {
      // Show it at once (the badge too), then ask the server for the true read times.
      const readAt = new Date().toISOString();
      queryClient.setQueryData<NoticeList>(noticeKeys.list(), (old) =>
        old ? { items: old.items.map((n) => (n.readAt ? n : { ...n, readAt })) } : old,
      );
      void queryClient.invalidateQueries({ queryKey: noticeKeys.list() });
    },
  });
}
