import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import type { Binder, binderPatch } from "../../../../shared/schemas/binders";
import { api } from "../../../lib/api-client";
import { binderKeys } from "./keys";

export type BinderChanges = z.output<typeof binderPatch>;

export function updateBinder(id: number, changes: BinderChanges): Promise<Binder> {
  return api.patch<Binder>(`/api/binders/${id}`, changes);
}

export function useUpdateBinder(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (changes: BinderChanges) => updateBinder(id, changes),
    meta: { errorsShownInline: true },
    onSuccess: (binder) => {
      queryClient.setQueryData(binderKeys.detail(id), binder);
      void queryClient.invalidateQueries({ queryKey: binderKeys.lists() });
    },
  });
}
