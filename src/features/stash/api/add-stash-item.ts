import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { StashItem } from "../../../../shared/schemas/stash";
import { api } from "../../../lib/api-client";
import { stashKeys } from "./keys";

export type StashAdd = { inkId: number; runningLow?: boolean };

/** Adds one catalogue ink; the answer is the whole stash. */
export async function addStashItem({ inkId, runningLow = false }: StashAdd): Promise<StashItem[]> {
  return (await api.post<{ items: StashItem[] }>("/api/stash/items", { inkId, runningLow })).items;
}

export function useAddStashItem() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addStashItem,
    onSuccess: (items) => queryClient.setQueryData(stashKeys.mine(), items),
  });
}
