import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import type { StashItem, stashPut } from "../../../../shared/schemas/stash";
import { api } from "../../../lib/api-client";
import { stashKeys } from "./keys";

export type StashReplacement = z.output<typeof stashPut>;

/** Replaces the whole stash in one go (all or nothing on the server). */
export async function replaceStash(input: StashReplacement): Promise<StashItem[]> {
  return (await api.put<{ items: StashItem[] }>("/api/stash", input)).items;
}

export function useReplaceStash() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: replaceStash,
    meta: { errorsShownInline: true },
    onSuccess: (items) => queryClient.setQueryData(stashKeys.mine(), items),
  });
}
