import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { Binder } from "../../../../shared/schemas/binders";
import { api } from "../../../lib/api-client";
import { binderKeys } from "./keys";

export type BinderItemRef = { binderId: number; stripId: number };

export function removeBinderItem({ binderId, stripId }: BinderItemRef): Promise<void> {
  return api.delete<void>(`/api/binders/${binderId}/items/${stripId}`);
}

/** `errorsShownInline`: the save popover shows its own errors; elsewhere leave it false for a toast. */
export function useRemoveBinderItem({ errorsShownInline = false }: { errorsShownInline?: boolean } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeBinderItem,
    meta: { errorsShownInline },
    onSuccess: (_data, { binderId, stripId }) => {
      queryClient.setQueryData<number[]>(binderKeys.savedIn(stripId), (old) => old?.filter((id) => id !== binderId));
      queryClient.setQueryData<Binder>(binderKeys.detail(binderId), (old) =>
        old ? { ...old, itemCount: Math.max(0, old.itemCount - 1), items: old.items.filter((i) => i.stripId !== stripId) } : old,
      );
    },
    onSettled: (_data, _error, { binderId, stripId }) => {
      void queryClient.invalidateQueries({ queryKey: binderKeys.savedIn(stripId) });
      void queryClient.invalidateQueries({ queryKey: binderKeys.detail(binderId) });
      void queryClient.invalidateQueries({ queryKey: binderKeys.lists() });
    },
  });
}
