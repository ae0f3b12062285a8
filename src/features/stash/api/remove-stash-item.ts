import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { StashItem } from "../../../../shared/schemas/stash";
import { api } from "../../../lib/api-client";
import { stashKeys } from "./keys";

export function removeStashItem(inkId: number): Promise<void> {
  return api.delete<void>(`/api/stash/items/${inkId}`);
}

export function useRemoveStashItem() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeStashItem,
    onSuccess: (_data, inkId) => {
      queryClient.setQueryData<StashItem[] | null>(stashKeys.mine(), (old) => old?.filter((i) => i.ink.id !== inkId) ?? old);
    },
  });
}
