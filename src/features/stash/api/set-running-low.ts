import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { StashItem } from "../../../../shared/schemas/stash";
import { api } from "../../../lib/api-client";
import { stashKeys } from "./keys";

export type RunningLowChange = { inkId: number; runningLow: boolean };

export async function setRunningLow({ inkId, runningLow }: RunningLowChange): Promise<StashItem[]> {
  return (await api.patch<{ items: StashItem[] }>(`/api/stash/items/${inkId}`, { runningLow })).items;
}

export function useSetRunningLow() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setRunningLow,
    onSuccess: (items) => queryClient.setQueryData(stashKeys.mine(), items),
  });
}
