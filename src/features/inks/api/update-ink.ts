import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import type { Ink, inkPatch } from "../../../../shared/schemas/inks";
import { api } from "../../../lib/api-client";
import { brandKeys, inkKeys } from "./keys";

export type InkChanges = z.output<typeof inkPatch>;

export function updateInk(id: number, changes: InkChanges): Promise<Ink> {
  return api.patch<Ink>(`/api/inks/${id}`, changes);
}

export function useUpdateInk(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (changes: InkChanges) => updateInk(id, changes),
    meta: { errorsShownInline: true },
    onSuccess: (ink, changes) => {
      queryClient.setQueryData(inkKeys.detail(id), ink);
      void queryClient.invalidateQueries({ queryKey: inkKeys.lists() });
      if (changes.brandId !== undefined) void queryClient.invalidateQueries({ queryKey: brandKeys.list() });
    },
  });
}
