import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "../../../lib/api-client";
import { binderKeys } from "./keys";

export type BinderItemAdd = { binderId: number; stripId: number; note?: string };

/** Saves a published strip to one of my binders: 409 `already_saved`, 422 for an unpublished strip. */
export function addBinderItem({ binderId, stripId, note }: BinderItemAdd): Promise<{ binderId: number; stripId: number }> {
  return api.post(`/api/binders/${binderId}/items`, note ? { stripId, note } : { stripId });
}

export function useAddBinderItem() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addBinderItem,
    meta: { errorsShownInline: true },
    onSuccess: (_data, { binderId, stripId }) => {
      queryClient.setQueryData<number[]>(binderKeys.savedIn(stripId), (old) => (old && !old.includes(binderId) ? [...old, binderId] : old));
    },
    // After a 409 too: the strip is in that binder, whatever this screen thought.
    onSettled: (_data, _error, { binderId, stripId }) => {
      void queryClient.invalidateQueries({ queryKey: binderKeys.savedIn(stripId) });
      void queryClient.invalidateQueries({ queryKey: binderKeys.detail(binderId) });
      void queryClient.invalidateQueries({ queryKey: binderKeys.lists() });
    },
  });
}
