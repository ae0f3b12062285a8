import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { Strip, StripPatch } from "../../../../shared/schemas/strips";
import { api } from "../../../lib/api-client";
import { memberKeys, stripKeys } from "./keys";

export function updateStrip(id: number, patch: StripPatch): Promise<Strip> {
  return api.patch<Strip>(`/api/strips/${id}`, patch);
}

export function useUpdateStrip(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (patch: StripPatch) => updateStrip(id, patch),
    meta: { errorsShownInline: true },
    onSuccess: (strip) => {
      queryClient.setQueryData(stripKeys.detail(id), strip);
      void queryClient.invalidateQueries({ queryKey: stripKeys.related(id) });
      void queryClient.invalidateQueries({ queryKey: stripKeys.lists() });
      void queryClient.invalidateQueries({ queryKey: memberKeys.detail(strip.author.id) });
    },
  });
}
