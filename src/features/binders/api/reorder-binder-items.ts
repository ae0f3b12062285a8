import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { Binder } from "../../../../shared/schemas/binders";
import { toast } from "../../../components/ui/toast";
import { api, errorMessage } from "../../../lib/api-client";
import { binderKeys } from "./keys";

export function reorderBinderItems(binderId: number, stripIds: number[]): Promise<Binder> {
  return api.put<Binder>(`/api/binders/${binderId}/order`, { stripIds });
}

/**
 * Sets a binder's order at once on screen and then on the server. Reorders of one binder share a
 * scope, so they reach the server one after another in the order they were made; a failure puts
 * the last order the server accepted back and says why.
 */
export function useReorderBinderItems(binderId: number) {
  const queryClient = useQueryClient();
  const key = binderKeys.detail(binderId);
  const orderKey = binderKeys.order(binderId);
  const othersPending = () => queryClient.isMutating({ mutationKey: orderKey }) > 1;
  return useMutation({
    mutationKey: orderKey,
    scope: { id: orderKey.join(":") },
    mutationFn: (stripIds: number[]) => reorderBinderItems(binderId, stripIds),
    // Shown as a toast here, with the rollback, rather than by the query client's generic one.
    meta: { errorsShownInline: true },
    onMutate: async (stripIds) => {
      await queryClient.cancelQueries({ queryKey: key, exact: true });
      const previous = queryClient.getQueryData<Binder>(key);
      if (previous) {
        const byId = new Map(previous.items.map((item) => [item.stripId, item]));
        const items = stripIds.flatMap((id, position) => {
          const item = byId.get(id);
          return item ? [{ ...item, position }] : [];
        });
        queryClient.setQueryData<Binder>(key, { ...previous, items });
      }
      return { previous };
    },
    onError: (error, _stripIds, context) => {
      // A later move still on its way builds on this one; let the final refetch settle it.
      if (context?.previous && !othersPending()) queryClient.setQueryData(key, context.previous);
      toast.error(errorMessage(error), "The new order was not saved");
    },
    onSuccess: (binder) => {
      if (!othersPending()) queryClient.setQueryData(key, binder);
    },
    onSettled: (_binder, error) => {
      if (error && !othersPending()) void queryClient.invalidateQueries({ queryKey: key, exact: true });
    },
  });
}
